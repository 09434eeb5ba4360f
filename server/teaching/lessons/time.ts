/** Wall-clock times in a named time zone, turned into instants, with nothing but Intl. */

export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

/** The wall-clock reading of an instant in a zone, as "YYYY-MM-DDTHH:mm". */
function wallClock(instant: Date, timeZone: string): string {
  const parts = Object.fromEntries(
    new Intl.DateTimeFormat('en-US', { timeZone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit' })
      .formatToParts(instant)
      .map((p) => [p.type, p.value]),
  );
  return `${parts.year}-${parts.month}-${parts.day}T${parts.hour}:${parts.minute}`;
}

function asUtcMs(local: string): number {
  const [date, time] = local.split('T');
  const [y, m, d] = date.split('-').map(Number);
  const [h, min] = time.split(':').map(Number);
  return Date.UTC(y, m - 1, d, h, min);
}

/**
 * The instant at which clocks in `timeZone` read `local`; null when they never do (the hour
 * skipped when clocks go forward) or `local` is not a real date. In the repeated hour when clocks
 * go back, the earlier of the two instants.
 */
export function zonedToUtc(local: string, timeZone: string): Date | null {
  const target = asUtcMs(local);
  if (Number.isNaN(target)) return null;
  const candidates = new Set<number>();
  // The zone's offset near the target, tried from both sides of a change.
  for (const probe of [target - 36e5 * 14, target, target + 36e5 * 14]) {
    const offset = asUtcMs(wallClock(new Date(probe), timeZone)) - Math.floor(probe / 60000) * 60000;
    candidates.add(target - offset);
  }
  const hits = [...candidates].filter((ms) => wallClock(new Date(ms), timeZone) === local).sort((a, b) => a - b);
  return hits.length ? new Date(hits[0]) : null;
}
