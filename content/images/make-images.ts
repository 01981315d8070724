// Draws the demo scenario's illustrations as SVG and renders them to PNG beside this file.
// Run: node --import tsx content/images/make-images.ts
import fs from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';

const ink = '#1d4d3a';
const inkSoft = '#4f7a67';
const inkFaint = '#c9d8cf';
const brass = '#b8892f';
const brassSoft = '#e6d3a8';
const paper = '#f7f4ec';
const paperDeep = '#ece6d6';
const oxide = '#a4372a';
const font = 'DejaVu Sans, sans-serif';

const W = 800;
const H = 560;

function frame(title: string, body: string, note = ''): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
  <defs>
    <pattern id="hatch" width="8" height="8" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
      <line x1="0" y1="0" x2="0" y2="8" stroke="${oxide}" stroke-width="2"/>
    </pattern>
    <pattern id="grid" width="20" height="20" patternUnits="userSpaceOnUse">
      <path d="M20 0H0V20" fill="none" stroke="${paperDeep}" stroke-width="1"/>
    </pattern>
  </defs>
  <rect width="${W}" height="${H}" fill="${paper}"/>
  <rect width="${W}" height="${H}" fill="url(#grid)"/>
  ${body}
  <rect x="0" y="${H - 52}" width="${W}" height="52" fill="${ink}"/>
  <text x="24" y="${H - 20}" font-family="${font}" font-size="20" font-weight="bold" fill="${paper}">${title}</text>
  <text x="${W - 24}" y="${H - 20}" font-family="${font}" font-size="15" fill="${brassSoft}" text-anchor="end">${note}</text>
</svg>`;
}

const label = (x: number, y: number, text: string, opts: { size?: number; color?: string; anchor?: string; bold?: boolean } = {}) =>
  `<text x="${x}" y="${y}" font-family="${font}" font-size="${opts.size ?? 16}" fill="${opts.color ?? ink}" text-anchor="${opts.anchor ?? 'start'}"${opts.bold ? ' font-weight="bold"' : ''}>${text}</text>`;

const leader = (x1: number, y1: number, x2: number, y2: number) =>
  `<line x1="${x1}" y1="${y1}" x2="${x2}" y2="${y2}" stroke="${ink}" stroke-width="1.5"/><circle cx="${x1}" cy="${y1}" r="3.5" fill="${ink}"/>`;

function dimension(x1: number, y1: number, x2: number, y2: number, text: string, color = brass): string {
  const mx = (x1 + x2) / 2;
  const my = (y1 + y2) / 2;
  const angle = Math.atan2(y2 - y1, x2 - x1);
  const a = 9;
  const head = (x: number, y: number, dir: number) => {
    const p1 = [x + a * Math.cos(angle + dir + 0.4), y + a * Math.sin(angle + dir + 0.4)];
    const p2 = [x + a * Math.cos(angle + dir - 0.4), y + a * Math.sin(angle + dir - 0.4)];
    return `<path d="M${x} ${y}L${p1[0].toFixed(1)} ${p1[1].toFixed(1)}L${p2[0].toFixed(1)} ${p2[1].toFixed(1)}Z" fill="${color}"/>`;
  };
  return `<line x1="${x1}" y1="${y1}" x2="${x2}" y2="${y2}" stroke="${color}" stroke-width="2"/>${head(x1, y1, 0)}${head(x2, y2, Math.PI)}
  <rect x="${mx - 6 - text.length * 4.6}" y="${my - 14}" width="${12 + text.length * 9.2}" height="24" rx="4" fill="${paper}" stroke="${color}"/>
  ${label(mx, my + 3, text, { size: 15, color: ink, anchor: 'middle', bold: true })}`;
}

function rotor(cx: number, cy: number, r: number, hat: number, vented = true): string {
  let holes = '';
  for (let i = 0; i < 5; i++) {
    const a = (i * 2 * Math.PI) / 5 - Math.PI / 2;
    holes += `<circle cx="${(cx + hat * 0.62 * Math.cos(a)).toFixed(1)}" cy="${(cy + hat * 0.62 * Math.sin(a)).toFixed(1)}" r="${(hat * 0.11).toFixed(1)}" fill="${paper}" stroke="${ink}" stroke-width="2"/>`;
  }
  let vanes = '';
  for (let i = 0; i < (vented ? 36 : 0); i++) {
    const a = (i * 2 * Math.PI) / 36;
    vanes += `<line x1="${(cx + (hat + 14) * Math.cos(a)).toFixed(1)}" y1="${(cy + (hat + 14) * Math.sin(a)).toFixed(1)}" x2="${(cx + (r - 8) * Math.cos(a + 0.12)).toFixed(1)}" y2="${(cy + (r - 8) * Math.sin(a + 0.12)).toFixed(1)}" stroke="${inkFaint}" stroke-width="2"/>`;
  }
  return `<circle cx="${cx}" cy="${cy}" r="${r}" fill="#dfe4df" stroke="${ink}" stroke-width="3"/>${vanes}
  <circle cx="${cx}" cy="${cy}" r="${hat}" fill="${paperDeep}" stroke="${ink}" stroke-width="3"/>
  <circle cx="${cx}" cy="${cy}" r="${hat * 0.3}" fill="${paper}" stroke="${ink}" stroke-width="2"/>${holes}`;
}

function caliperArc(cx: number, cy: number, rIn: number, rOut: number, from: number, to: number, fill: string): string {
  const pt = (r: number, deg: number) => {
    const a = (deg * Math.PI) / 180;
    return `${(cx + r * Math.cos(a)).toFixed(1)} ${(cy + r * Math.sin(a)).toFixed(1)}`;
  };
  return `<path d="M${pt(rOut, from)} A${rOut} ${rOut} 0 0 1 ${pt(rOut, to)} L${pt(rIn, to)} A${rIn} ${rIn} 0 0 0 ${pt(rIn, from)} Z" fill="${fill}" stroke="${ink}" stroke-width="3" stroke-linejoin="round"/>`;
}

function caliperOverRotor(opts: { title: string; note: string; rotorLabel: string; caliperLabel: string; adapterLabel: string; fourPiston: boolean }) {
  const cx = 330;
  const cy = 270;
  const r = 200;
  let pistons = '';
  const n = opts.fourPiston ? 2 : 1;
  for (let i = 0; i < n; i++) {
    const deg = n === 1 ? -90 : -104 + i * 28;
    const a = (deg * Math.PI) / 180;
    pistons += `<circle cx="${(cx + (r - 24) * Math.cos(a)).toFixed(1)}" cy="${(cy + (r - 24) * Math.sin(a)).toFixed(1)}" r="${opts.fourPiston ? 15 + i * 2 : 22}" fill="${brassSoft}" stroke="${ink}" stroke-width="2"/>`;
  }
  const body = `${rotor(cx, cy, r, 82)}
  <path d="M${cx - 150} ${cy - 150} L${cx - 120} ${cy - 230} L${cx + 120} ${cy - 230} L${cx + 150} ${cy - 150} L${cx + 112} ${cy - 132} L${cx - 112} ${cy - 132} Z" fill="${inkSoft}" opacity="0.35" stroke="${ink}" stroke-width="2"/>
  ${caliperArc(cx, cy, r - 46, r + 22, opts.fourPiston ? -128 : -112, opts.fourPiston ? -52 : -68, brass)}
  ${pistons}
  <circle cx="${cx - 128}" cy="${cy - 206}" r="9" fill="${paper}" stroke="${ink}" stroke-width="2"/>
  <circle cx="${cx + 128}" cy="${cy - 206}" r="9" fill="${paper}" stroke="${ink}" stroke-width="2"/>
  ${leader(cx + 70, cy - 190, 600, 90)}${label(606, 95, opts.caliperLabel, { bold: true })}
  ${leader(cx + 128, cy - 160, 600, 150)}${label(606, 155, opts.adapterLabel)}
  ${leader(cx + 150, cy + 90, 600, 300)}${label(606, 305, opts.rotorLabel)}
  ${dimension(cx - r, cy + 232, cx + r, cy + 232, opts.rotorLabel.split(' ')[0])}`;
  return frame(opts.title, body, opts.note);
}

function adapterBracket() {
  const body = `
  <path d="M170 150 Q150 150 150 170 L150 330 Q150 360 180 370 L560 400 Q600 402 610 370 L640 200 Q645 165 610 160 Z" fill="${inkFaint}" stroke="${ink}" stroke-width="4" stroke-linejoin="round"/>
  <circle cx="230" cy="230" r="20" fill="${paper}" stroke="${ink}" stroke-width="3"/>
  <circle cx="230" cy="320" r="20" fill="${paper}" stroke="${ink}" stroke-width="3"/>
  <rect x="430" y="190" width="70" height="50" rx="8" fill="${brass}" stroke="${ink}" stroke-width="3"/>
  <rect x="530" y="300" width="70" height="50" rx="8" fill="${brass}" stroke="${ink}" stroke-width="3"/>
  <circle cx="465" cy="215" r="10" fill="${paper}" stroke="${ink}" stroke-width="2"/>
  <circle cx="565" cy="325" r="10" fill="${paper}" stroke="${ink}" stroke-width="2"/>
  ${dimension(190, 230, 190, 320, '90')}
  ${dimension(465, 250, 565, 290, '130', ink)}
  ${label(150, 120, 'knuckle side: axial bolts M12×1.5', { size: 17 })}
  ${label(430, 170, 'caliper side: radial bosses', { size: 17 })}
  ${label(340, 450, '20 mm plate, two per car', { size: 16, color: inkSoft, anchor: 'middle' })}`;
  return frame('Northgate adapter NGF-H31-V330-F', body, 'dimensions in mm');
}

function knuckleGrind() {
  const body = `
  <path d="M200 90 L380 90 L420 180 L420 420 L260 460 L180 380 Z" fill="${inkFaint}" stroke="${ink}" stroke-width="4" stroke-linejoin="round"/>
  <rect x="380" y="150" width="120" height="60" rx="10" fill="${inkFaint}" stroke="${ink}" stroke-width="4"/>
  <rect x="380" y="300" width="120" height="60" rx="10" fill="${inkFaint}" stroke="${ink}" stroke-width="4"/>
  <circle cx="465" cy="180" r="14" fill="${paper}" stroke="${ink}" stroke-width="3"/>
  <circle cx="465" cy="330" r="14" fill="${paper}" stroke="${ink}" stroke-width="3"/>
  <path d="M420 360 L470 360 L470 384 Q445 396 420 388 Z" fill="url(#hatch)" stroke="${oxide}" stroke-width="3"/>
  <rect x="520" y="280" width="40" height="110" fill="${brass}" opacity="0.8" stroke="${ink}" stroke-width="3"/>
  ${leader(452, 378, 600, 430)}${label(606, 424, 'grind ≈ 2 mm', { bold: true, color: oxide })}${label(606, 446, 'casting lug, both sides', { size: 14 })}
  ${leader(540, 300, 600, 250)}${label(606, 245, 'adapter must sit flat', { size: 15 })}
  ${label(210, 70, 'H31 front knuckle, outboard view', { size: 17 })}`;
  return frame('Knuckle casting lug: the grind step', body, 'paint bare metal afterwards');
}

function wheelSection(opts: { title: string; note: string; clearanceMm: number; clearanceText: string; spacer: number }) {
  // schematic half-section, hub axis along the bottom; the gap at the barrel is drawn 5× enlarged
  const fits = opts.clearanceMm >= 3;
  const axisY = 470;
  const hubX = 300;
  const caliperTop = 230;
  const barrelY = caliperTop - opts.clearanceMm * 5;
  const spacerW = opts.spacer * 2.2;
  const wheelX = hubX + spacerW;
  const body = `
  <line x1="60" y1="${axisY}" x2="740" y2="${axisY}" stroke="${inkSoft}" stroke-width="1.5" stroke-dasharray="14 6 3 6"/>
  <rect x="${hubX - 60}" y="${axisY - 70}" width="60" height="70" fill="${inkFaint}" stroke="${ink}" stroke-width="3"/>
  ${opts.spacer > 0 ? `<rect x="${hubX}" y="${axisY - 74}" width="${spacerW}" height="74" fill="${brassSoft}" stroke="${ink}" stroke-width="3"/>${label(hubX - 70, axisY - 30, `${opts.spacer} mm spacer`, { size: 14, anchor: 'end' })}` : ''}
  <rect x="${hubX - 46}" y="${caliperTop + 30}" width="28" height="${axisY - 70 - caliperTop - 30}" fill="#dfe4df" stroke="${ink}" stroke-width="3"/>
  <path d="M${hubX - 100} ${caliperTop} L${hubX + 36} ${caliperTop} L${hubX + 36} ${caliperTop + 70} L${hubX - 100} ${caliperTop + 70} Z" fill="${brass}" stroke="${ink}" stroke-width="3"/>
  ${label(hubX - 32, caliperTop + 58, 'caliper', { size: 15, anchor: 'middle', color: paper, bold: true })}
  <path d="M${hubX - 150} ${barrelY} L${wheelX + 190} ${barrelY} L${wheelX + 190} ${barrelY - 54} L${wheelX + 172} ${barrelY - 54} L${wheelX + 162} ${barrelY - 16} L${hubX - 132} ${barrelY - 16} L${hubX - 140} ${barrelY - 54} L${hubX - 158} ${barrelY - 54} L${hubX - 158} ${barrelY} Z" fill="${fits ? inkFaint : '#e9c9c3'}" stroke="${fits ? ink : oxide}" stroke-width="3" stroke-linejoin="round" opacity="${fits ? 1 : 0.85}"/>
  <path d="M${wheelX} ${axisY - 10} L${wheelX + 26} ${axisY - 10} L${wheelX + 150} ${barrelY} L${wheelX + 120} ${barrelY} Z" fill="${inkFaint}" stroke="${ink}" stroke-width="3"/>
  <line x1="${hubX + 36}" y1="${caliperTop}" x2="700" y2="${caliperTop}" stroke="${inkSoft}" stroke-dasharray="4 4"/>
  <line x1="${wheelX + 190}" y1="${barrelY}" x2="700" y2="${barrelY}" stroke="${inkSoft}" stroke-dasharray="4 4"/>
  ${dimension(700, fits ? barrelY : caliperTop, 700, fits ? caliperTop : barrelY, opts.clearanceText, fits ? brass : oxide)}
  ${label(520, fits ? caliperTop + 22 : caliperTop - 8, 'caliper: rotor edge + 20 mm', { size: 14 })}
  ${label(520, fits ? barrelY - 8 : barrelY + 22, 'barrel inner radius', { size: 14 })}
  ${label(60, 60, 'gap drawn 5× enlarged', { size: 14, color: inkSoft })}
  ${fits ? '' : label(60, 90, 'caliper meets the barrel', { size: 18, bold: true, color: oxide })}`;
  return frame(opts.title, body, opts.note);
}

function spacer() {
  let holes = '';
  for (let i = 0; i < 5; i++) {
    const a = (i * 2 * Math.PI) / 5 - Math.PI / 2;
    holes += `<circle cx="${(260 + 120 * Math.cos(a)).toFixed(1)}" cy="${(260 + 120 * Math.sin(a)).toFixed(1)}" r="16" fill="${paper}" stroke="${ink}" stroke-width="3"/>`;
  }
  const body = `
  <circle cx="260" cy="260" r="180" fill="${inkFaint}" stroke="${ink}" stroke-width="4"/>
  <circle cx="260" cy="260" r="70" fill="${paper}" stroke="${ink}" stroke-width="4"/>${holes}
  ${dimension(190, 260, 330, 260, '66.6')}
  <rect x="560" y="80" width="40" height="360" fill="${inkFaint}" stroke="${ink}" stroke-width="4"/>
  <rect x="600" y="190" width="22" height="140" fill="${brassSoft}" stroke="${ink}" stroke-width="3"/>
  ${dimension(560, 470, 600, 470, '10')}
  ${label(640, 240, 'spigot', { size: 15 })}${label(640, 260, 'keeps the wheel', { size: 15 })}${label(640, 280, 'hub-centred', { size: 15 })}
  ${label(80, 470, 'PCD 5 × 112, slip-on', { size: 17 })}`;
  return frame('Hub-centric spacer NGF-SP10-HC-112', body, 'dimensions in mm');
}

function wheelBolts() {
  const bolt = (x: number, len: number, name: string, color: string) => {
    const px = len * 6;
    return `<path d="M${x} 120 L${x + 60} 120 L${x + 60} 150 L${x + 46} 172 L${x + 14} 172 L${x} 150 Z" fill="${color}" stroke="${ink}" stroke-width="3" stroke-linejoin="round"/>
    <rect x="${x + 14}" y="172" width="32" height="${px}" fill="${inkFaint}" stroke="${ink}" stroke-width="3"/>
    ${Array.from({ length: Math.floor(px / 10) }, (_, i) => `<line x1="${x + 14}" y1="${176 + i * 10}" x2="${x + 46}" y2="${181 + i * 10}" stroke="${inkSoft}" stroke-width="1.5"/>`).join('')}
    ${label(x + 30, 172 + px + 30, `${len} mm`, { anchor: 'middle', bold: true })}${label(x + 30, 172 + px + 52, name, { anchor: 'middle', size: 14 })}`;
  };
  const body = `${bolt(140, 26, 'stock', paperDeep)}${bolt(360, 36, '+10 mm spacer', brass)}${bolt(580, 41, '+15 mm spacer', brass)}
  ${label(400, 80, 'M12×1.5, 60° cone seat: keep at least 12 mm of thread in the hub', { anchor: 'middle', size: 17 })}`;
  return frame('Wheel bolts by spacer thickness', body, 'thread length under the seat');
}

function drumInHat() {
  const body = `${rotor(330, 270, 200, 96, false)}
  <circle cx="330" cy="270" r="84" fill="none" stroke="${brass}" stroke-width="10" stroke-dasharray="120 30"/>
  ${caliperArc(330, 270, 150, 214, 20, 62, brass)}
  ${leader(390, 200, 570, 110)}${label(576, 115, '160 mm parking drum', { bold: true })}${label(576, 136, 'inside the hat, shoes kept', { size: 14 })}
  ${leader(470, 400, 570, 330)}${label(576, 335, 'Regent caliper on', { size: 15 })}${label(576, 355, 'Northgate bracket', { size: 15 })}
  ${dimension(130, 502, 530, 502, '300')}`;
  return frame('Regent rear rotor TR-300-012-DH', body, 'rear, outboard view');
}

function relocation(title: string, offset: string) {
  const body = `${rotor(300, 300, 190, 80)}
  ${caliperArc(300, 300, 150, 212, -120, -60, paperDeep)}
  <g opacity="0.95">${caliperArc(300, 300, 160, 222, -120, -60, brass)}</g>
  <rect x="180" y="70" width="240" height="40" rx="8" fill="${inkFaint}" stroke="${ink}" stroke-width="3"/>
  ${label(606, 100, `caliper moved ${offset} mm`, { size: 17, bold: true, color: brass })}${label(606, 122, 'outward, same caliper', { size: 15 })}
  ${leader(300 + 190 * Math.cos(-1.1), 300 + 190 * Math.sin(-1.1), 600, 260)}${label(606, 265, '330 mm rotor', { size: 15 })}
  ${leader(300, 90, 600, 180)}${label(606, 185, 'relocation bracket', { size: 15, bold: true })}`;
  return frame(title, body, 'stock caliper kept');
}

function threadInsert() {
  const body = `
  <rect x="160" y="110" width="300" height="320" fill="${inkFaint}" stroke="${ink}" stroke-width="4"/>
  <rect x="270" y="110" width="80" height="200" fill="${brassSoft}" stroke="${ink}" stroke-width="3"/>
  <rect x="290" y="110" width="40" height="200" fill="${paper}" stroke="${ink}" stroke-width="2"/>
  ${Array.from({ length: 13 }, (_, i) => `<line x1="270" y1="${118 + i * 15}" x2="290" y2="${124 + i * 15}" stroke="${ink}" stroke-width="1.5"/><line x1="330" y1="${118 + i * 15}" x2="350" y2="${124 + i * 15}" stroke="${ink}" stroke-width="1.5"/>`).join('')}
  <rect x="262" y="100" width="96" height="14" fill="${brass}" stroke="${ink}" stroke-width="2"/>
  ${leader(350, 200, 560, 160)}${label(566, 165, 'insert M16×1.5 outside', { size: 15, bold: true })}${label(566, 186, 'M12×1.5 inside, 18 mm', { size: 15 })}
  ${leader(310, 250, 560, 280)}${label(566, 285, 'drill 14.5, tap square', { size: 15 })}${label(566, 306, 'to the lug face', { size: 15 })}
  ${label(170, 460, 'knuckle caliper lug, section', { size: 16, color: inkSoft })}`;
  return frame('Thread repair in the knuckle lug', body, 'keyed solid insert');
}

function antiRollBar() {
  const body = `
  <path d="M120 360 L200 360 Q230 360 240 330 L280 220 Q290 200 320 200 L480 200 Q510 200 520 220 L560 330 Q570 360 600 360 L680 360" fill="none" stroke="${ink}" stroke-width="22" stroke-linecap="round" stroke-linejoin="round"/>
  <path d="M120 360 L200 360 Q230 360 240 330 L280 220 Q290 200 320 200 L480 200 Q510 200 520 220 L560 330 Q570 360 600 360 L680 360" fill="none" stroke="${inkSoft}" stroke-width="12" stroke-linecap="round" stroke-linejoin="round"/>
  <rect x="330" y="176" width="44" height="48" rx="6" fill="${brass}" stroke="${ink}" stroke-width="3"/>
  <rect x="426" y="176" width="44" height="48" rx="6" fill="${brass}" stroke="${ink}" stroke-width="3"/>
  <circle cx="120" cy="360" r="18" fill="${paper}" stroke="${ink}" stroke-width="4"/>
  <circle cx="680" cy="360" r="18" fill="${paper}" stroke="${ink}" stroke-width="4"/>
  ${leader(352, 176, 300, 110)}${label(180, 100, 'two-bolt bush brackets', { size: 15 })}
  ${label(400, 430, '22 mm bar (H31 stock: 18 mm)', { anchor: 'middle', size: 17, bold: true })}`;
  return frame('H40 rear anti-roll bar on the H31', body, 'drop links reused');
}

function shimStack() {
  const body = `
  <rect x="120" y="300" width="560" height="90" fill="${inkFaint}" stroke="${ink}" stroke-width="4"/>
  ${label(140, 360, 'adapter boss', { size: 16 })}
  <rect x="330" y="280" width="140" height="20" fill="${brassSoft}" stroke="${ink}" stroke-width="2"/>
  <rect x="330" y="270" width="140" height="10" fill="${brass}" stroke="${ink}" stroke-width="2"/>
  <rect x="120" y="150" width="560" height="120" fill="${brass}" opacity="0.75" stroke="${ink}" stroke-width="4"/>
  ${label(140, 215, 'caliper mounting ear', { size: 16 })}
  <rect x="385" y="110" width="30" height="300" fill="${paperDeep}" stroke="${ink}" stroke-width="2"/>
  ${dimension(520, 270, 520, 300, '1.5')}
  ${label(560, 120, '1.0 + 0.5 mm shims', { size: 16, bold: true })}${label(560, 142, 'per radial bolt', { size: 15 })}`;
  return frame('Centring shim stack', body, 'centre the caliper on the rotor');
}

function wheelFace() {
  let spokes = '';
  for (let i = 0; i < 5; i++) {
    const a = (i * 72 * Math.PI) / 180;
    spokes += `<path d="M-24 -66 L24 -66 L46 -192 L-46 -192 Z" transform="translate(300 280) rotate(${(a * 180) / Math.PI})" fill="${paperDeep}" stroke="${ink}" stroke-width="3"/>`;
  }
  const body = `<circle cx="300" cy="280" r="230" fill="#2b2b2b"/>
  <circle cx="300" cy="280" r="205" fill="${paperDeep}" stroke="${ink}" stroke-width="4"/>
  <circle cx="300" cy="280" r="190" fill="#3d4f46" stroke="${ink}" stroke-width="2"/>${spokes}
  <circle cx="300" cy="280" r="72" fill="${inkFaint}" stroke="${ink}" stroke-width="3"/>
  <circle cx="300" cy="280" r="30" fill="${brass}" stroke="${ink}" stroke-width="3"/>
  ${label(580, 200, '16 × 7 ET38', { size: 22, bold: true })}${label(580, 230, '205/55R16', { size: 18 })}${label(580, 260, '+10 mm spacer', { size: 18 })}${label(580, 290, 'M12×1.5 × 36 bolts', { size: 18 })}`;
  return frame('H40 wheel on the H31', body, 'front and rear');
}

const images: Record<string, () => string> = {
  'h31-vela-caliper.png': () =>
    caliperOverRotor({
      title: 'Vela four-piston caliper on the H31',
      note: 'left front, wheel off',
      rotorLabel: '330 mm vented rotor',
      caliperLabel: 'OV-355-104-L',
      adapterLabel: 'NGF-H31-V330-F',
      fourPiston: true,
    }),
  'h40-vela-caliper.png': () =>
    caliperOverRotor({
      title: 'Vela four-piston caliper on the H40',
      note: 'right front, no grinding',
      rotorLabel: '330 mm vented rotor',
      caliperLabel: 'OV-355-104-R',
      adapterLabel: 'NGF-H40-V330-F',
      fourPiston: true,
    }),
  'h31-h40-caliper-300.png': () =>
    caliperOverRotor({
      title: 'H40 caliper and 300 mm rotor on the H31',
      note: 'relocation bracket',
      rotorLabel: '300 mm vented rotor',
      caliperLabel: 'H40-615-057-L',
      adapterLabel: 'NGF-H31-H300-F',
      fourPiston: false,
    }),
  'h31-vela-adapter.png': adapterBracket,
  'h31-knuckle-grind.png': knuckleGrind,
  'h31-vela-wheel-16in.png': () =>
    wheelSection({ title: '16-inch wheel over the Vela caliper', note: 'H40 alloy 16 × 7 ET38', clearanceMm: 4, clearanceText: '4 mm', spacer: 10 }),
  'h31-vela-wheel-15in.png': () =>
    wheelSection({ title: '15-inch wheel over the Vela caliper', note: 'H31 steel 15 × 6 ET38', clearanceMm: -9, clearanceText: '−9 mm', spacer: 10 }),
  'spacer-10-hub-centric.png': spacer,
  'wheel-bolts-m12.png': wheelBolts,
  'regent-rear-drum-in-hat.png': drumInHat,
  'regent-front-relocation.png': () => relocation('Regent caliper moved out for the 330 mm rotor', '9'),
  'knuckle-thread-insert.png': threadInsert,
  'h31-rear-anti-roll-bar.png': antiRollBar,
  'shim-stack.png': shimStack,
  'h31-h40-wheel.png': wheelFace,
};

const dir = import.meta.dirname;
for (const [file, draw] of Object.entries(images)) {
  const png = await sharp(Buffer.from(draw())).png({ palette: true, colours: 64, compressionLevel: 9, effort: 10 }).toBuffer();
  await fs.writeFile(path.join(dir, file), png);
  console.log(`${file}  ${(png.length / 1024).toFixed(1)} KB`);
}
