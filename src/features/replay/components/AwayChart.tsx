import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import { SEATS, type Seat } from '../../../../shared/seats';
import type { ReplayStep } from '../replay-steps';

/** Each seat gets its own dash and marker as well as its own shade, so lines differ without colour. */
const LINES: Record<Seat, { stroke: string; dash?: string; dot: 'circle' | 'square' | 'diamond' | 'triangle' }> = {
  east: { stroke: '#1b2430', dot: 'circle' },
  south: { stroke: '#0a6560', dash: '8 4', dot: 'square' },
  west: { stroke: '#7a3b00', dash: '2 4', dot: 'diamond' },
  north: { stroke: '#4a3a9e', dash: '12 4 2 4', dot: 'triangle' },
};

function Marker({ cx, cy, shape, stroke }: { cx?: number; cy?: number; shape: string; stroke: string }) {
  if (cx === undefined || cy === undefined) return null;
  const common = { fill: 'var(--color-card)', stroke, strokeWidth: 2 };
  if (shape === 'square') return <rect x={cx - 4.5} y={cy - 4.5} width={9} height={9} {...common} />;
  if (shape === 'diamond') return <path d={`M${cx} ${cy - 6} L${cx + 6} ${cy} L${cx} ${cy + 6} L${cx - 6} ${cy} Z`} {...common} />;
  if (shape === 'triangle') return <path d={`M${cx} ${cy - 6} L${cx + 6} ${cy + 5} L${cx - 6} ${cy + 5} Z`} {...common} />;
  return <circle cx={cx} cy={cy} r={5} {...common} />;
}

/** Tiles away from each seat's nearest pattern at every step, with the numbers in a table too. */
export function AwayChart({ steps, names, current }: { steps: ReplayStep[]; names: Record<Seat, string>; current: number }) {
  const data = steps.map((step, i) => ({ step: i, label: `${i}. ${step.short}`, ...step.away }));
  return (
    <figure className="flex flex-col gap-2">
      <figcaption className="font-semibold">Tiles away from the nearest pattern, step by step</figcaption>
      {/* Hidden from screen readers, who get the table below, so it must hold nothing focusable either. */}
      <div aria-hidden="true">
        <LineChart accessibilityLayer={false} responsive style={{ width: '100%', height: 260 }} data={data} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
          <CartesianGrid stroke="#d9d5cc" />
          <XAxis dataKey="label" tick={{ fill: '#1b2430', fontSize: 13 }} />
          <YAxis allowDecimals={false} tick={{ fill: '#1b2430', fontSize: 13 }} width={32} domain={[0, 'dataMax + 1']} />
          <Tooltip />
          <Legend />
          <ReferenceLine x={data[current]?.label} stroke="#1f4fd8" strokeWidth={2} />
          {SEATS.map((s) => (
            <Line
              key={s}
              type="monotone"
              dataKey={s}
              name={`${names[s]} (${s})`}
              stroke={LINES[s].stroke}
              strokeWidth={2.5}
              strokeDasharray={LINES[s].dash}
              dot={(p: { cx?: number; cy?: number; index?: number }) => <Marker key={`${s}-${p.index}`} cx={p.cx} cy={p.cy} shape={LINES[s].dot} stroke={LINES[s].stroke} />}
              isAnimationActive={false}
            />
          ))}
        </LineChart>
      </div>
      <details>
        <summary className="cursor-pointer font-medium">The numbers in a table</summary>
        <div className="overflow-x-auto">
          <table className="mt-2 text-base">
            <caption className="sr-only">Tiles away per seat at each step</caption>
            <thead>
              <tr>
                <th scope="col" className="pr-3 text-left">Step</th>
                {SEATS.map((s) => (
                  <th key={s} scope="col" className="pr-3 text-left">
                    {names[s]} ({s})
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {data.map((row) => (
                <tr key={row.step}>
                  <th scope="row" className="pr-3 text-left font-medium">
                    {row.label}
                  </th>
                  {SEATS.map((s) => (
                    <td key={s} className="pr-3">
                      {row[s]}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
