// Client-safe settings. Nothing secret may be added here.
export const publicEnv = {
  appName: 'Rimeline',
} as const;
