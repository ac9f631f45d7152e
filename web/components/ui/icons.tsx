import type { SVGProps } from 'react';

// Small line icons drawn for Bindery on a 16-unit grid. They sit beside a word, never
// alone, so they are hidden from assistive technology.
type IconProps = SVGProps<SVGSVGElement>;

function Icon({ children, ...props }: IconProps) {
  return (
    <svg
      viewBox="0 0 16 16"
      width="1em"
      height="1em"
      fill="none"
      stroke="currentColor"
      strokeWidth={1.6}
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden="true"
      focusable="false"
      {...props}
    >
      {children}
    </svg>
  );
}

/** An octagon with a cross: stop, this must change. */
export function ErrorIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M5.5 1.5h5l4 4v5l-4 4h-5l-4-4v-5z" />
      <path d="M6 6l4 4M10 6l-4 4" />
    </Icon>
  );
}

/** A triangle with a bar and dot: look at this. */
export function WarningIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M8 1.8l6.6 11.7H1.4z" />
      <path d="M8 6.2v3.3" />
      <circle cx="8" cy="11.6" r="0.5" fill="currentColor" />
    </Icon>
  );
}

/** A circle with an "i": for your information. */
export function InfoIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <circle cx="8" cy="8" r="6.5" />
      <path d="M8 7.2v4" />
      <circle cx="8" cy="4.9" r="0.5" fill="currentColor" />
    </Icon>
  );
}

export function CheckIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <circle cx="8" cy="8" r="6.5" />
      <path d="M5 8.3l2 2 4-4.3" />
    </Icon>
  );
}

export function ClockIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <circle cx="8" cy="8" r="6.5" />
      <path d="M8 4.5V8l2.5 1.5" />
    </Icon>
  );
}

/** A curved arrow back to the start: the approval no longer matches. */
export function StaleIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M2.5 8a5.5 5.5 0 1 0 1.7-4" />
      <path d="M2.3 1.8v2.6h2.6" />
    </Icon>
  );
}

/** A pencil: the reviewer asks for edits. */
export function PencilIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M10.5 2.5l3 3-8 8H2.5v-3z" />
      <path d="M9 4l3 3" />
    </Icon>
  );
}

/** A dashed circle: nothing asked yet. */
export function DashedCircleIcon(props: IconProps) {
  return (
    <Icon {...props} strokeDasharray="2.2 2">
      <circle cx="8" cy="8" r="6.5" />
    </Icon>
  );
}

export function CloseIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M4 4l8 8M12 4l-8 8" />
    </Icon>
  );
}

export function ChevronDownIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M4 6l4 4 4-4" />
    </Icon>
  );
}

/** An empty shelf bracket for "nothing here yet". */
export function EmptyShelfIcon(props: IconProps) {
  return (
    <Icon {...props} strokeWidth={1.2}>
      <path d="M1.5 11.5h13M3 11.5v2M13 11.5v2" />
      <path d="M4 11.5V7.5h3v4M8.5 11.5V5.5h3.5v6" strokeDasharray="1.5 1.3" />
    </Icon>
  );
}
