import type { SVGProps } from "react";

/**
 * A small set of 16×16 stroke icons drawn for Ketwise (1.5 px strokes, round joins).
 * Decorative: aria-hidden; give the surrounding control its accessible name.
 */
type IconProps = SVGProps<SVGSVGElement>;

function Svg({ children, className, ...rest }: IconProps) {
  return (
    <svg
      viewBox="0 0 16 16"
      fill="none"
      stroke="currentColor"
      strokeWidth={1.5}
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden
      className={className ?? "size-4 shrink-0"}
      {...rest}
    >
      {children}
    </svg>
  );
}

export const IconChevronDown = (p: IconProps) => (
  <Svg {...p}>
    <path d="m4 6 4 4 4-4" />
  </Svg>
);
export const IconChevronRight = (p: IconProps) => (
  <Svg {...p}>
    <path d="m6 4 4 4-4 4" />
  </Svg>
);
export const IconCheck = (p: IconProps) => (
  <Svg {...p}>
    <path d="m3.5 8.5 3 3 6-7" />
  </Svg>
);
export const IconClose = (p: IconProps) => (
  <Svg {...p}>
    <path d="m4 4 8 8M12 4l-8 8" />
  </Svg>
);
export const IconMenu = (p: IconProps) => (
  <Svg {...p}>
    <path d="M2.5 4.5h11M2.5 8h11M2.5 11.5h11" />
  </Svg>
);
export const IconInfo = (p: IconProps) => (
  <Svg {...p}>
    <circle cx="8" cy="8" r="6.25" />
    <path d="M8 7.25v4M8 4.9v.1" />
  </Svg>
);
export const IconWarning = (p: IconProps) => (
  <Svg {...p}>
    <path d="M8 2.2 14.3 13.3H1.7Z" />
    <path d="M8 6.5v3.2M8 11.4v.1" />
  </Svg>
);
export const IconError = (p: IconProps) => (
  <Svg {...p}>
    <circle cx="8" cy="8" r="6.25" />
    <path d="m5.8 5.8 4.4 4.4M10.2 5.8l-4.4 4.4" />
  </Svg>
);
export const IconSuccess = (p: IconProps) => (
  <Svg {...p}>
    <circle cx="8" cy="8" r="6.25" />
    <path d="m5.3 8.2 1.9 1.9 3.5-4" />
  </Svg>
);
export const IconCopy = (p: IconProps) => (
  <Svg {...p}>
    <rect x="5.5" y="5.5" width="8" height="8" rx="1.5" />
    <path d="M10.5 3.5V3A1.5 1.5 0 0 0 9 1.5H4A1.5 1.5 0 0 0 2.5 3v5A1.5 1.5 0 0 0 4 9.5h.5" />
  </Svg>
);
export const IconPlus = (p: IconProps) => (
  <Svg {...p}>
    <path d="M8 3v10M3 8h10" />
  </Svg>
);
export const IconSignOut = (p: IconProps) => (
  <Svg {...p}>
    <path d="M6.5 13.5H3.5a1 1 0 0 1-1-1v-9a1 1 0 0 1 1-1h3M10.5 11l3-3-3-3M13.5 8H6" />
  </Svg>
);
export const IconExternal = (p: IconProps) => (
  <Svg {...p}>
    <path d="M9.5 2.5h4v4M13.5 2.5 7.5 8.5M12 9.5v3a1 1 0 0 1-1 1H3.5a1 1 0 0 1-1-1V5a1 1 0 0 1 1-1h3" />
  </Svg>
);
/* Navigation glyphs. */
export const IconDashboard = (p: IconProps) => (
  <Svg {...p}>
    <rect x="2" y="2" width="5" height="6" rx="1" />
    <rect x="9" y="2" width="5" height="3.5" rx="1" />
    <rect x="2" y="10" width="5" height="4" rx="1" />
    <rect x="9" y="7.5" width="5" height="6.5" rx="1" />
  </Svg>
);
export const IconRuns = (p: IconProps) => (
  <Svg {...p}>
    <path d="M2.5 4h11M2.5 8h11M2.5 12h7" />
    <circle cx="12.5" cy="12" r="1.2" />
  </Svg>
);
export const IconNewRun = (p: IconProps) => (
  <Svg {...p}>
    <path d="M4 2.8v10.4L12.8 8Z" />
  </Svg>
);
export const IconLibrary = (p: IconProps) => (
  <Svg {...p}>
    <path d="M2.5 2.5v11M5.5 2.5v11M8.5 3.2l3.8-.9 2.2 10.5-3.8.9Z" />
  </Svg>
);
export const IconCompare = (p: IconProps) => (
  <Svg {...p}>
    <path d="M5 2.5v11M11 2.5v11M2.5 6H5M5 10h2.5M8.5 5H11M11 11h2.5" />
  </Svg>
);
export const IconKey = (p: IconProps) => (
  <Svg {...p}>
    <circle cx="5" cy="11" r="2.6" />
    <path d="m6.9 9.1 6.3-6.3M11 5l1.7 1.7M9.4 6.6l1.2 1.2" />
  </Svg>
);
export const IconMembers = (p: IconProps) => (
  <Svg {...p}>
    <circle cx="6" cy="5.5" r="2.5" />
    <path d="M1.8 13.5a4.2 4.2 0 0 1 8.4 0M10.6 3.3a2.4 2.4 0 0 1 0 4.4M12.2 9.6a4.2 4.2 0 0 1 2 3.9" />
  </Svg>
);
export const IconBilling = (p: IconProps) => (
  <Svg {...p}>
    <rect x="1.8" y="3.5" width="12.4" height="9" rx="1.5" />
    <path d="M1.8 6.5h12.4M4.5 10h2.5" />
  </Svg>
);
export const IconAudit = (p: IconProps) => (
  <Svg {...p}>
    <path d="M4 1.8h5.5L12.5 5v9.2H4Z" />
    <path d="M9.5 1.8V5h3M6 8h4.5M6 10.5h4.5" />
  </Svg>
);
export const IconDocs = (p: IconProps) => (
  <Svg {...p}>
    <path d="M5.5 4.5 2 8l3.5 3.5M10.5 4.5 14 8l-3.5 3.5" />
  </Svg>
);
export const IconSpark = (p: IconProps) => (
  <Svg {...p}>
    <path d="M8 1.8v3M8 11.2v3M1.8 8h3M11.2 8h3M3.6 3.6l2 2M10.4 10.4l2 2M3.6 12.4l2-2M10.4 5.6l2-2" />
  </Svg>
);
/* Action glyphs (files, search, sorting, stop, save); "size-4" without shrink-0 as drawn for the workspace. */
export const IconUpload = (p: IconProps) => (
  <Svg className="size-4" {...p}>
    <path d="M8 10.5V2.5M5 5.5l3-3 3 3M2.5 10.5v2a1 1 0 0 0 1 1h9a1 1 0 0 0 1-1v-2" />
  </Svg>
);
export const IconDownload = (p: IconProps) => (
  <Svg className="size-4" {...p}>
    <path d="M8 2.5v8M5 7.5l3 3 3-3M2.5 10.5v2a1 1 0 0 0 1 1h9a1 1 0 0 0 1-1v-2" />
  </Svg>
);
export const IconSearch = (p: IconProps) => (
  <Svg className="size-4" {...p}>
    <circle cx="7" cy="7" r="4.25" />
    <path d="M10.2 10.2 13.5 13.5" />
  </Svg>
);
export const IconBook = (p: IconProps) => (
  <Svg className="size-4" {...p}>
    <path d="M3 3.25A1.25 1.25 0 0 1 4.25 2H13v10H4.25A1.25 1.25 0 0 0 3 13.25zM3 13.25A1.25 1.25 0 0 0 4.25 14.5H13" />
  </Svg>
);
export const IconSort = ({ dir, ...p }: IconProps & { dir: "asc" | "desc" | false }) => (
  <Svg {...p} className="size-3.5">
    <path d="M5 6.5 8 3.5l3 3" opacity={dir === "asc" ? 1 : 0.35} />
    <path d="M5 9.5 8 12.5l3-3" opacity={dir === "desc" ? 1 : 0.35} />
  </Svg>
);
export const IconStop = (p: IconProps) => (
  <Svg className="size-4" {...p}>
    <rect x="4" y="4" width="8" height="8" rx="1.5" />
  </Svg>
);
export const IconSave = (p: IconProps) => (
  <Svg className="size-4" {...p}>
    <path d="M3 2.5h8l2.5 2.5v8.5H2.5v-11zM5 2.5v3.5h5V2.5M5 13.5V9.5h6v4" />
  </Svg>
);
