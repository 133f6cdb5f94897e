import { useEffect, useRef } from 'react';
import { useNavigation } from 'react-router-dom';

/**
 * Search as you type: calls `apply(text)` a moment after the last key, when `text` differs from
 * what the page shows (`current`). Never while another navigation is under way: a debounced URL
 * update landing during a click on the menu would cancel that navigation and bring the person
 * back to the list. When the navigation settles on this page, the wait starts again.
 */
export function useSearchAsYouType(text: string, current: string, apply: (text: string) => void, delayMs = 250): void {
  const navigating = useNavigation().state !== 'idle';
  const applyRef = useRef(apply);
  useEffect(() => {
    applyRef.current = apply;
  });
  useEffect(() => {
    if (navigating || text === current) return;
    const timer = window.setTimeout(() => applyRef.current(text), delayMs);
    return () => window.clearTimeout(timer);
  }, [text, current, delayMs, navigating]);
}
