/** A lesson's start as its teacher set it, and in the reader's own zone when that differs. */
export function lessonTimes(startsAt: string, timeZone: string): { there: string; here: string | null } {
  const date = new Date(startsAt);
  const format = (zone: string) => new Intl.DateTimeFormat('en-US', { timeZone: zone, dateStyle: 'full', timeStyle: 'short' }).format(date);
  const mine = Intl.DateTimeFormat().resolvedOptions().timeZone;
  const there = `${format(timeZone)} (${timeZone.replace(/_/g, ' ')})`;
  return { there, here: mine && mine !== timeZone && format(mine) !== format(timeZone) ? `${format(mine)} your time` : null };
}

export function timeZones(): string[] {
  const supported = (Intl as unknown as { supportedValuesOf?: (key: string) => string[] }).supportedValuesOf?.('timeZone');
  return supported?.length ? supported : ['UTC', 'America/New_York', 'America/Chicago', 'America/Denver', 'America/Los_Angeles', 'Europe/London'];
}

export function myTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}
