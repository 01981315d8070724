/**
 * The app's own icons, drawn inline so they look the same on every machine: characters such as "＋" or a lock
 * emoji come from whatever fonts a reader has, and without an emoji font they show as empty boxes.
 */
type IconProps = { className?: string };

function Icon({ className = 'h-4 w-4', children }: IconProps & { children: React.ReactNode }) {
  return (
    <svg
      viewBox="0 0 20 20"
      className={`inline-block shrink-0 ${className}`}
      fill="none"
      stroke="currentColor"
      strokeWidth="2"
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden
      focusable="false"
      data-icon
    >
      {children}
    </svg>
  );
}

export function PlusIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M10 4v12M4 10h12" />
    </Icon>
  );
}

export function LockIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <rect x="4" y="9" width="12" height="8" rx="1.5" />
      <path d="M7 9V6.5a3 3 0 0 1 6 0V9" />
    </Icon>
  );
}

export function CheckIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M4 10.5l4 4 8-9" />
    </Icon>
  );
}

export function CrossIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M5 5l10 10M15 5L5 15" />
    </Icon>
  );
}

/** A ring: a figure that is not a verdict (an estimate, or nothing entered yet). */
export function OpenIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <circle cx="10" cy="10" r="5.5" />
    </Icon>
  );
}

export function VerdictIcon({ tone, className }: IconProps & { tone: 'pass' | 'fail' | 'open' | 'none' }) {
  if (tone === 'pass') return <CheckIcon className={className} />;
  if (tone === 'fail') return <CrossIcon className={className} />;
  return <OpenIcon className={className} />;
}

/** A warning triangle, for cautions. */
export function WarningIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M10 3L18 17H2Z" />
      <path d="M10 8.5v4" />
      <path d="M10 15v.01" />
    </Icon>
  );
}
