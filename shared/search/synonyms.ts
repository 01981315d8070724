// Names the trade uses for the same thing. A query that says one of them also finds the others; the
// words the reader typed still rank first. Each group lists phrases as a reader would type them;
// hyphens and spaces inside a phrase are treated like everywhere else in search ("anti-roll bar"
// also covers "antiroll bar"). Keep groups to true equivalents: a near relative ("bracket" and
// "adapter") would bring in swaps the reader did not ask for.

export const tradeSynonyms: readonly (readonly string[])[] = [
  ['rotor', 'disc', 'disk', 'brake disc', 'brake rotor'],
  ['rotors', 'discs', 'disks'],
  ['tyre', 'tire'],
  ['tyres', 'tires'],
  ['caliper', 'calliper'],
  ['calipers', 'callipers'],
  ['parking brake', 'handbrake', 'hand brake', 'e-brake', 'emergency brake'],
  ['anti-roll bar', 'sway bar', 'stabiliser bar', 'stabilizer bar'],
  ['wheel bolt', 'lug bolt'],
  ['wheel bolts', 'lug bolts'],
  ['wheel nut', 'lug nut'],
  ['wheel nuts', 'lug nuts'],
  ['centre bore', 'center bore', 'hub bore'],
  ['hub-centric ring', 'spigot ring', 'centring ring', 'centering ring'],
  ['pcd', 'bolt pattern', 'bolt circle', 'lug pattern'],
  ['offset', 'et'],
  ['knuckle', 'upright', 'hub carrier'],
  ['brake line', 'brake hose'],
  ['brake lines', 'brake hoses'],
  ['caliper bracket', 'caliper carrier'],
  ['coilover', 'coil over'],
  ['aluminium', 'aluminum'],
  ['estate', 'wagon'],
  ['saloon', 'sedan'],
];
