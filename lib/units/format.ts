// Display helpers for the user's unit choice; values are stored in SI.
export function formatElevation(metres: number, units: 'imperial' | 'metric'): string {
  return units === 'imperial' ? `${Math.round(metres / 0.3048).toLocaleString('en-US')} ft` : `${Math.round(metres).toLocaleString('en-US')} m`;
}
