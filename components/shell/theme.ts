/**
 * Colour-scheme preference: "system" (follow prefers-color-scheme), "light" or "dark".
 * Stored in localStorage under THEME_KEY; applied as a `.light`/`.dark` class on <html>
 * (app/globals.css tokens honour both). `themeInitScript` runs before first paint.
 */
export type ThemePreference = "system" | "light" | "dark";

export const THEME_KEY = "kw-theme";

export const themeInitScript = `(function(){try{var t=localStorage.getItem("${THEME_KEY}");var c=document.documentElement.classList;c.remove("light","dark");if(t==="light"||t==="dark")c.add(t);}catch(e){}})();`;

export function readTheme(): ThemePreference {
  try {
    const t = localStorage.getItem(THEME_KEY);
    return t === "light" || t === "dark" ? t : "system";
  } catch {
    return "system";
  }
}

const CHANGE_EVENT = "kw-theme-change";

/** Subscribes to theme changes (this tab and others); for useSyncExternalStore. */
export function subscribeTheme(onChange: () => void): () => void {
  window.addEventListener(CHANGE_EVENT, onChange);
  window.addEventListener("storage", onChange);
  return () => {
    window.removeEventListener(CHANGE_EVENT, onChange);
    window.removeEventListener("storage", onChange);
  };
}

export function applyTheme(pref: ThemePreference): void {
  const c = document.documentElement.classList;
  c.remove("light", "dark");
  if (pref !== "system") c.add(pref);
  try {
    if (pref === "system") localStorage.removeItem(THEME_KEY);
    else localStorage.setItem(THEME_KEY, pref);
  } catch {
    /* storage unavailable: the choice lasts for this page only */
  }
  window.dispatchEvent(new Event(CHANGE_EVENT));
}
