import type { PassRecord } from '../../../../shared/exchange';
import { SEATS, type Seat } from '../../../../shared/seats';
import { capitalise, sideOf, type Side } from '../../../lib/seating';

const POINT: Record<Side, [number, number]> = { bottom: [120, 200], right: [210, 110], top: [120, 20], left: [30, 110] };

/** Arrows between the four seats, one per seat that sent tiles, each with its count. */
export function MoveDiagram({ pass, names, viewer = null }: { pass: PassRecord; names: Record<Seat, string>; viewer?: Seat | null }) {
  const moves = SEATS.flatMap((from) => {
    const ids = [...pass.sent[from], ...pass.forwarded[from]];
    if (ids.length === 0) return [];
    const to = SEATS.find((s) => pass.received[s].some((id) => ids.includes(id)))!;
    return [{ from, to, count: ids.length, blind: pass.forwarded[from].length }];
  });
  const words = moves.map((m) => `${capitalise(m.from)} sent ${m.count} to ${m.to}${m.blind ? ` (${m.blind} blind)` : ''}`).join('; ');
  return (
    <figure className="flex flex-col items-center">
      <svg viewBox="0 0 240 220" className="w-full max-w-xs" role="img" aria-label={words || 'No tiles moved.'}>
        <defs>
          <marker id="move-head" viewBox="0 0 10 10" refX="8" refY="5" markerWidth="5" markerHeight="5" orient="auto">
            <path d="M0 0 L10 5 L0 10 z" fill="var(--color-accent)" />
          </marker>
        </defs>
        <rect x={40} y={32} width={160} height={156} rx={14} fill="var(--color-accent-soft)" />
        {moves.map((m, i) => {
          const [x1, y1] = POINT[sideOf(viewer, m.from)];
          const [x2, y2] = POINT[sideOf(viewer, m.to)];
          // Shorten each arrow and bend it a little so opposite arrows do not overlap.
          const dx = x2 - x1;
          const dy = y2 - y1;
          const len = Math.hypot(dx, dy);
          const sx = x1 + (dx / len) * 22;
          const sy = y1 + (dy / len) * 22;
          const ex = x2 - (dx / len) * 26;
          const ey = y2 - (dy / len) * 26;
          const cx = (sx + ex) / 2 - (dy / len) * 18;
          const cy = (sy + ey) / 2 + (dx / len) * 18;
          // The count sits a third of the way along, clear of where across arrows cross.
          const t = 0.3;
          const lx = (1 - t) ** 2 * sx + 2 * (1 - t) * t * cx + t * t * ex;
          const ly = (1 - t) ** 2 * sy + 2 * (1 - t) * t * cy + t * t * ey;
          return (
            <g key={i}>
              <path d={`M${sx} ${sy} Q${cx} ${cy} ${ex} ${ey}`} fill="none" stroke="var(--color-accent)" strokeWidth={3.5} markerEnd="url(#move-head)" />
              <text x={lx} y={ly + 5} textAnchor="middle" fontSize={14} fontWeight={700} fill="var(--color-ink)" stroke="var(--color-card)" strokeWidth={4} paintOrder="stroke">
                {m.count}
              </text>
            </g>
          );
        })}
        {SEATS.map((s) => {
          const [x, y] = POINT[sideOf(viewer, s)];
          return (
            <g key={s}>
              <circle cx={x} cy={y} r={18} fill="var(--color-card)" stroke="var(--color-ink)" strokeWidth={2} />
              <text x={x} y={y + 5} textAnchor="middle" fontSize={14} fontWeight={700} fill="var(--color-ink)">
                {s[0].toUpperCase()}
              </text>
            </g>
          );
        })}
      </svg>
      <figcaption className="text-center text-base">{moves.map((m) => `${names[m.from]} (${m.from}) → ${m.to}: ${m.count}${m.blind ? ` (${m.blind} blind)` : ''}`).join(' · ')}</figcaption>
    </figure>
  );
}
