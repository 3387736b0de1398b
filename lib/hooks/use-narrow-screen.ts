"use client";

import { useSyncExternalStore } from "react";

// Phone-sized windows (below Tailwind's "sm", 640 px). Charts use it to tilt their tick labels
// earlier: at 390 px six machine names side by side run into each other.
const QUERY = "(max-width: 639px)";

function subscribe(onChange: () => void) {
  const list = window.matchMedia(QUERY);
  list.addEventListener("change", onChange);
  return () => list.removeEventListener("change", onChange);
}

export function useNarrowScreen(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => window.matchMedia(QUERY).matches,
    () => false,
  );
}
