import {
  Children,
  cloneElement,
  isValidElement,
  useId,
  type ReactElement,
  type ReactNode,
} from "react";
import { cn } from "./cn";

/**
 * A CSS-only tooltip: shown while the trigger is hovered or holds keyboard focus, and
 * bound to it with aria-describedby (so it supplements, never replaces, the accessible
 * name). The trigger must be focusable (a button, link or input). Keep the text short.
 */
export function Tooltip({
  content,
  children,
  side = "top",
  className,
}: {
  content: ReactNode;
  children: ReactElement<{ "aria-describedby"?: string }>;
  side?: "top" | "bottom";
  className?: string;
}) {
  const id = useId();
  const child = Children.only(children);
  const described = [child.props["aria-describedby"], id].filter(Boolean).join(" ");
  return (
    <span className={cn("group/tt relative inline-flex", className)}>
      {isValidElement(child) ? cloneElement(child, { "aria-describedby": described }) : child}
      <span
        role="tooltip"
        id={id}
        className={cn(
          "pointer-events-none invisible absolute left-1/2 z-50 w-max max-w-64 -translate-x-1/2 rounded-md bg-ink px-2 py-1 text-xs leading-snug font-normal text-canvas opacity-0 shadow-pop transition-opacity duration-100",
          "group-focus-within/tt:visible group-focus-within/tt:opacity-100 group-hover/tt:visible group-hover/tt:opacity-100 group-hover/tt:delay-300",
          side === "top" ? "bottom-full mb-1.5" : "top-full mt-1.5",
        )}
      >
        {content}
      </span>
    </span>
  );
}
