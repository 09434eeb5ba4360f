/** The names a zone at UTC+0 with no summer time goes by (tz database links, from memory). */
const UTC_NAMES = new Set(['UTC', 'Etc/UTC', 'Etc/UCT', 'UCT', 'Etc/GMT', 'GMT', 'Etc/GMT0', 'Etc/GMT+0', 'Etc/GMT-0', 'GMT0', 'Etc/Greenwich', 'Greenwich', 'Etc/Universal', 'Universal', 'Etc/Zulu', 'Zulu']);

/** How a zone is written for people: "America/New York"; every name of UTC as "UTC". */
export function zoneLabel(zone: string): string {
  return UTC_NAMES.has(zone) ? 'UTC' : zone.replace(/_/g, ' ');
}

/** A lesson's start as its teacher set it, and in the reader's own zone when that differs. */
export function lessonTimes(startsAt: string, timeZone: string): { there: string; here: string | null } {
  const date = new Date(startsAt);
  const format = (zone: string) => new Intl.DateTimeFormat('en-US', { timeZone: zone, dateStyle: 'full', timeStyle: 'short' }).format(date);
  const mine = Intl.DateTimeFormat().resolvedOptions().timeZone;
  const there = `${format(timeZone)} (${zoneLabel(timeZone)})`;
  return { there, here: mine && mine !== timeZone && format(mine) !== format(timeZone) ? `${format(mine)} your time` : null };
}

/** UTC first (some engines leave it out of their list), then every zone the browser knows. */
export function timeZones(): string[] {
  const supported = (Intl as unknown as { supportedValuesOf?: (key: string) => string[] }).supportedValuesOf?.('timeZone');
  const zones = supported?.length ? supported : ['America/New_York', 'America/Chicago', 'America/Denver', 'America/Los_Angeles', 'Europe/London'];
  return ['UTC', ...zones.filter((z) => !UTC_NAMES.has(z))];
}

function offsetName(zone: string, at: Date): string | null {
  try {
    return new Intl.DateTimeFormat('en-US', { timeZone: zone, timeZoneName: 'longOffset' }).formatToParts(at).find((p) => p.type === 'timeZoneName')?.value ?? null;
  } catch {
    return null;
  }
}

/** Whether a zone is at UTC+0 in January and in July of this year, so in winter and in summer alike. */
function zeroAllYear(zone: string): boolean {
  const year = new Date().getFullYear();
  return [new Date(Date.UTC(year, 0, 15)), new Date(Date.UTC(year, 6, 15))].every((at) => {
    const name = offsetName(zone, at);
    return name === 'GMT' || name === 'GMT+00:00' || name === 'GMT-00:00';
  });
}

/**
 * The zone a new lesson starts in by default. A browser on UTC may report it by another of its names,
 * even a city the person never chose (a clock set to UTC can come back as "Africa/Abidjan", which shares
 * its rules). Any zone at UTC+0 all year is offered as "UTC": the times are the same, and nobody is
 * told they live in a city they did not pick; the list still holds every city to choose from.
 */
export function defaultTimeZone(detected: string | undefined): string {
  if (!detected || UTC_NAMES.has(detected)) return 'UTC';
  return zeroAllYear(detected) ? 'UTC' : detected;
}

export function myTimeZone(): string {
  return defaultTimeZone(Intl.DateTimeFormat().resolvedOptions().timeZone);
}
