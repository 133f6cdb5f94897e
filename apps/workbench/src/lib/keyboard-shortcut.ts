import { useEffect, useRef } from 'react';

/**
 * Page-wide keyboard shortcuts such as Alt+N. A shortcut never fires while the user is typing
 * (an input, a text area, a select or editable text has focus), so Alt+N inside a field
 * stays the character the keyboard makes there.
 */
export interface Shortcut {
  /** The physical key, as KeyboardEvent.code names it (KeyN): Alt changes `key` on some layouts. */
  code: string;
  alt?: boolean;
  ctrl?: boolean;
  shift?: boolean;
}

/** Whether keys pressed with this element focused are text being typed. */
export function isTypingTarget(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (
    target.isContentEditable ||
    target.closest('[contenteditable=""], [contenteditable="true"], [contenteditable="plaintext-only"]')
  )
    return true;
  const tag = target.tagName;
  if (tag === 'TEXTAREA' || tag === 'SELECT') return true;
  if (tag !== 'INPUT') return false;
  const type = (target as HTMLInputElement).type;
  return !['button', 'checkbox', 'radio', 'submit', 'reset', 'file', 'image', 'range', 'color'].includes(type);
}

export function matchesShortcut(
  e: Pick<KeyboardEvent, 'code' | 'altKey' | 'ctrlKey' | 'metaKey' | 'shiftKey'>,
  s: Shortcut,
): boolean {
  return (
    e.code === s.code &&
    e.altKey === Boolean(s.alt) &&
    e.ctrlKey === Boolean(s.ctrl) &&
    e.shiftKey === Boolean(s.shift) &&
    !e.metaKey
  );
}

/** Run `onPress` when the shortcut is pressed anywhere on the page, except while typing. */
export function useKeyboardShortcut(shortcut: Shortcut, onPress: () => void, enabled = true): void {
  const latest = useRef(onPress);
  useEffect(() => {
    latest.current = onPress;
  });
  const { code, alt, ctrl, shift } = shortcut;
  useEffect(() => {
    if (!enabled) return;
    const onKeyDown = (e: KeyboardEvent) => {
      if (e.defaultPrevented || e.repeat || isTypingTarget(e.target)) return;
      if (!matchesShortcut(e, { code, alt, ctrl, shift })) return;
      e.preventDefault();
      latest.current();
    };
    document.addEventListener('keydown', onKeyDown);
    return () => document.removeEventListener('keydown', onKeyDown);
  }, [code, alt, ctrl, shift, enabled]);
}
