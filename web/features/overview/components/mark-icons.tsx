import type { SVGProps } from 'react';
import type { MarkKind } from '../channel-plan';

// Line icons for the channel plan's marks, drawn like the shell's own (16-unit grid,
// stroke in the text colour); each sits beside its word, so it is hidden from
// assistive technology.
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

/** Two lines running into one: two functions on one channel. */
function SharedIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M1.5 3.5h3l4 4.5h6M1.5 12.5h3l4-4.5" />
      <path d="M12 5.5l2.5 2.5-2.5 2.5" />
    </Icon>
  );
}

/** A plug with its lead cut: nothing carries the channel. */
function UnroutedIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M1.5 8h4M10.5 8h4" />
      <path d="M5.5 5v6h2.5V5zM8 6.5h1.5M8 9.5h1.5" />
      <path d="M11.5 4.5l1.5-1.5M11.5 11.5l1.5 1.5" />
    </Icon>
  );
}

/** An arrow past a bar: beyond what the link carries. */
function BeyondIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M9.5 2v12" />
      <path d="M1.5 8h12M11 5.5l2.5 2.5-2.5 2.5" />
    </Icon>
  );
}

/** A dashed box: a pin carries a channel nothing is planned on. */
function EmptyIcon(props: IconProps) {
  return (
    <Icon {...props} strokeDasharray="2 1.8">
      <rect x="2.5" y="2.5" width="11" height="11" rx="1.5" />
    </Icon>
  );
}

export const MARK_ICONS: Record<MarkKind, (props: IconProps) => React.ReactElement> = {
  shared: SharedIcon,
  unrouted: UnroutedIcon,
  'beyond-link': BeyondIcon,
  'no-function': EmptyIcon,
  finding: FindingIcon,
  accepted: AcceptedIcon,
};

/** A small flag: some other finding of the checks is about this channel. */
function FindingIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M4 14V2.5M4 3h7l-1.5 2.5L11 8H4" />
    </Icon>
  );
}

/** A tick in a box: a finding looked at and accepted. */
function AcceptedIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <rect x="2.5" y="2.5" width="11" height="11" rx="2" />
      <path d="M5.5 8.2 7.2 10l3.3-4" />
    </Icon>
  );
}

/** A small radio mast: the receiver that sends telemetry. */
export function TelemetryIcon(props: IconProps) {
  return (
    <Icon {...props}>
      <path d="M8 7v7.5M5.5 14.5h5" />
      <circle cx="8" cy="5.5" r="1.2" />
      <path d="M5 3a4 4 0 0 0 0 5M11 3a4 4 0 0 1 0 5" />
    </Icon>
  );
}
