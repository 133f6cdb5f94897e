import type { FiguresQuery } from '@gloaming/contracts';

export const figuresKeys = {
  all: ['figures'] as const,
  period: (q: FiguresQuery) => [...figuresKeys.all, q.period ?? 'last-12-months', q.from ?? '', q.to ?? ''] as const,
};
