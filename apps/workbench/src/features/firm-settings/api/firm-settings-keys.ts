export const firmSettingsKeys = {
  all: ['firm-settings'] as const,
  current: () => [...firmSettingsKeys.all, 'current'] as const,
};
