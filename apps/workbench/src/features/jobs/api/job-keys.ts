export const jobKeys = {
  all: ['jobs'] as const,
  list: () => [...jobKeys.all, 'list'] as const,
  pack: (jobId: string) => [...jobKeys.all, 'pack', jobId] as const,
};
