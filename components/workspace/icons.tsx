import type { SVGProps } from "react";

/** Workspace icons in the product's stroke style (1.5 px, round caps, 16 px box). */
function Svg(props: SVGProps<SVGSVGElement>) {
  return (
    <svg
      viewBox="0 0 16 16"
      fill="none"
      stroke="currentColor"
      strokeWidth={1.5}
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden
      className="size-4"
      {...props}
    />
  );
}

export const IconUpload = (p: SVGProps<SVGSVGElement>) => (
  <Svg {...p}>
    <path d="M8 10.5V2.5M5 5.5l3-3 3 3M2.5 10.5v2a1 1 0 0 0 1 1h9a1 1 0 0 0 1-1v-2" />
  </Svg>
);
export const IconDownload = (p: SVGProps<SVGSVGElement>) => (
  <Svg {...p}>
    <path d="M8 2.5v8M5 7.5l3 3 3-3M2.5 10.5v2a1 1 0 0 0 1 1h9a1 1 0 0 0 1-1v-2" />
  </Svg>
);
export const IconSearch = (p: SVGProps<SVGSVGElement>) => (
  <Svg {...p}>
    <circle cx="7" cy="7" r="4.25" />
    <path d="M10.2 10.2 13.5 13.5" />
  </Svg>
);
export const IconBook = (p: SVGProps<SVGSVGElement>) => (
  <Svg {...p}>
    <path d="M3 3.25A1.25 1.25 0 0 1 4.25 2H13v10H4.25A1.25 1.25 0 0 0 3 13.25zM3 13.25A1.25 1.25 0 0 0 4.25 14.5H13" />
  </Svg>
);
export const IconSort = ({
  dir,
  ...p
}: SVGProps<SVGSVGElement> & { dir: "asc" | "desc" | false }) => (
  <Svg {...p} className="size-3.5">
    <path d="M5 6.5 8 3.5l3 3" opacity={dir === "asc" ? 1 : 0.35} />
    <path d="M5 9.5 8 12.5l3-3" opacity={dir === "desc" ? 1 : 0.35} />
  </Svg>
);
export const IconStop = (p: SVGProps<SVGSVGElement>) => (
  <Svg {...p}>
    <rect x="4" y="4" width="8" height="8" rx="1.5" />
  </Svg>
);
export const IconSave = (p: SVGProps<SVGSVGElement>) => (
  <Svg {...p}>
    <path d="M3 2.5h8l2.5 2.5v8.5H2.5v-11zM5 2.5v3.5h5V2.5M5 13.5V9.5h6v4" />
  </Svg>
);
