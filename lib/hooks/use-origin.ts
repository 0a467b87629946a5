"use client";
/**
 * The page's origin (e.g. http://localhost:3000) for code snippets, read from
 * `window.location` in the browser and `fallback` during server rendering.
 * The origin never changes while the page lives, so nothing is subscribed.
 */
import { useSyncExternalStore } from "react";

const subscribe = () => () => {};

export function useOrigin(fallback = ""): string {
  return useSyncExternalStore(
    subscribe,
    () => window.location.origin,
    () => fallback,
  );
}
