import { useCallback, useLayoutEffect, useState } from "react";

/**
 * The width [px] of the element the returned callback ref is put on, followed as it resizes; null until the
 * element is laid out (an element rendered later, e.g. once data arrives, is picked up when it mounts).
 */
export function useContainerWidth<T extends HTMLElement = HTMLDivElement>(): [(element: T | null) => void, number | null] {
  const [element, setElement] = useState<T | null>(null);
  const [width, setWidth] = useState<number | null>(null);
  const ref = useCallback((next: T | null) => setElement(next), []);
  useLayoutEffect(() => {
    if (!element) return;
    setWidth(element.clientWidth);
    if (typeof ResizeObserver === "undefined") return;
    const observer = new ResizeObserver(() => setWidth(element.clientWidth));
    observer.observe(element);
    return () => observer.disconnect();
  }, [element]);
  return [ref, width];
}
