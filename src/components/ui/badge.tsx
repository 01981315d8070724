import type { ReactNode } from 'react';

type Tone = 'ink' | 'brass' | 'oxide' | 'plain';
const tones: Record<Tone, string> = {
  ink: 'bg-ink-faint text-ink',
  brass: 'bg-brass-soft text-brass-deep',
  oxide: 'bg-oxide-soft text-oxide',
  plain: 'bg-paper-deep text-graphite',
};

export function Badge({ tone = 'plain', children }: { tone?: Tone; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center rounded-full px-2.5 py-0.5 text-xs font-bold ${tones[tone]}`}>{children}</span>
  );
}
