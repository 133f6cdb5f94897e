/**
 * Rows in wiring order that can be dragged by a handle: the pointer, or the keyboard (Space on
 * the handle, arrows, Space to drop, Escape to cancel), with spoken announcements that name the
 * positions. Alt+Up/Down on a row stays the quick keyboard move; this adds dragging beside it.
 */
import {
  DndContext,
  KeyboardSensor,
  PointerSensor,
  closestCenter,
  useSensor,
  useSensors,
  type Announcements,
  type DragEndEvent,
} from '@dnd-kit/core';
import { SortableContext, sortableKeyboardCoordinates, useSortable, verticalListSortingStrategy } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import type { ReactNode } from 'react';

/** A drag context for rows with these ids; `onMove(from, to)` gets positions in the list. */
export function SortableRows({
  ids,
  what,
  onMove,
  children,
}: {
  ids: readonly string[];
  /** What a row is, for the announcements ("fitting"). */
  what: string;
  onMove: (from: number, to: number) => void;
  children: ReactNode;
}) {
  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 4 } }),
    useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }),
  );
  const position = (id: string | number | undefined) => ids.indexOf(String(id)) + 1;
  const announcements: Announcements = {
    onDragStart: ({ active }) => `Picked up ${what} ${position(active.id)}. Arrow keys move it, Space drops it, Escape cancels.`,
    onDragOver: ({ active, over }) =>
      over
        ? `${what} ${position(active.id)} is over position ${position(over.id)}.`
        : `${what} ${position(active.id)} is not over a place.`,
    onDragEnd: ({ active, over }) =>
      over
        ? `${what} ${position(active.id)} dropped at position ${position(over.id)}.`
        : `${what} ${position(active.id)} dropped.`,
    onDragCancel: ({ active }) => `Moving ${what} ${position(active.id)} cancelled; it stays where it was.`,
  };
  const onDragEnd = ({ active, over }: DragEndEvent) => {
    if (!over || active.id === over.id) return;
    const from = ids.indexOf(String(active.id));
    const to = ids.indexOf(String(over.id));
    if (from >= 0 && to >= 0) onMove(from, to);
  };
  return (
    <DndContext sensors={sensors} collisionDetection={closestCenter} onDragEnd={onDragEnd} accessibility={{ announcements }}>
      <SortableContext items={[...ids]} strategy={verticalListSortingStrategy}>
        {children}
      </SortableContext>
    </DndContext>
  );
}

/** The row's drag wiring: spread `row` on the <tr>, render `handle` in its first cell. */
export function useSortableRow(id: string, label: string, index: number) {
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({ id });
  return {
    row: {
      ref: setNodeRef,
      style: { transform: CSS.Translate.toString(transform), transition },
      'data-dragging': isDragging ? 'true' : undefined,
    },
    isDragging,
    handle: (
      <button
        type="button"
        ref={setActivatorNodeRef}
        {...attributes}
        {...listeners}
        aria-label={`Drag ${label} to reorder`}
        aria-roledescription="sortable row"
        data-drag-handle={id}
        className="inline-flex h-9 cursor-grab touch-none items-center gap-1 rounded-control px-1 hover:bg-mist-100 focus-visible:ring-2 focus-visible:ring-lamp-400 focus-visible:outline-none active:cursor-grabbing"
      >
        <span aria-hidden="true">⠿</span>
        {index + 1}
      </button>
    ),
  };
}

/** A table row that can be dragged by the handle in its first cell. */
export function SortableTr({
  id,
  label,
  index,
  className = '',
  children,
  ...rest
}: {
  id: string;
  label: string;
  index: number;
  className?: string;
  children: ReactNode;
} & Omit<React.HTMLAttributes<HTMLTableRowElement>, 'children' | 'className' | 'style'> &
  Record<`data-${string}`, string>) {
  const { row, handle, isDragging } = useSortableRow(id, label, index);
  return (
    <tr {...rest} {...row} className={`${className} ${isDragging ? 'relative z-10 bg-lamp-50 shadow-raised' : ''}`}>
      <td className="w-12 py-1 pr-1 font-mono text-ink-muted">{handle}</td>
      {children}
    </tr>
  );
}
