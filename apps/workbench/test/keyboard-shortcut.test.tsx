import { cleanup, fireEvent, render } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { isTypingTarget, useKeyboardShortcut } from '../src/lib/keyboard-shortcut';

afterEach(cleanup);

function Page({ onNew }: { onNew: () => void }) {
  useKeyboardShortcut({ code: 'KeyN', alt: true }, onNew);
  return (
    <div>
      <button type="button">Filter</button>
      <input aria-label="Search" />
      <input aria-label="Include drafts" type="checkbox" />
      <textarea aria-label="Note" />
      <div aria-label="Rich" contentEditable suppressContentEditableWarning />
    </div>
  );
}

describe('useKeyboardShortcut (Alt+N for a new quote)', () => {
  it('fires for Alt+N on the page or on a button, by the physical key whatever character Alt makes', () => {
    const onNew = vi.fn();
    const { getByText } = render(<Page onNew={onNew} />);
    fireEvent.keyDown(document.body, { key: 'n', code: 'KeyN', altKey: true });
    // macOS makes a dead key of Alt+N: `key` is not "n", the code still is
    fireEvent.keyDown(getByText('Filter'), { key: 'Dead', code: 'KeyN', altKey: true });
    expect(onNew).toHaveBeenCalledTimes(2);
  });

  it('does not fire while typing in a field, nor for N alone, Ctrl+Alt+N or Alt+Shift+N', () => {
    const onNew = vi.fn();
    const { getByLabelText } = render(<Page onNew={onNew} />);
    for (const field of ['Search', 'Note', 'Rich'])
      fireEvent.keyDown(getByLabelText(field), { key: 'n', code: 'KeyN', altKey: true });
    fireEvent.keyDown(document.body, { key: 'n', code: 'KeyN' });
    fireEvent.keyDown(document.body, { key: 'n', code: 'KeyN', altKey: true, ctrlKey: true });
    fireEvent.keyDown(document.body, { key: 'N', code: 'KeyN', altKey: true, shiftKey: true });
    expect(onNew).not.toHaveBeenCalled();
    // a checkbox is not typing
    fireEvent.keyDown(getByLabelText('Include drafts'), { key: 'n', code: 'KeyN', altKey: true });
    expect(onNew).toHaveBeenCalledTimes(1);
  });

  it('knows which elements take typing', () => {
    const input = document.createElement('input');
    const radio = Object.assign(document.createElement('input'), { type: 'radio' });
    expect(isTypingTarget(input)).toBe(true);
    expect(isTypingTarget(document.createElement('select'))).toBe(true);
    expect(isTypingTarget(radio)).toBe(false);
    expect(isTypingTarget(document.createElement('button'))).toBe(false);
    expect(isTypingTarget(null)).toBe(false);
  });
});
