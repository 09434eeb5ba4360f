import { CartesianGrid, Legend, Line, LineChart, Tooltip, XAxis, YAxis } from 'recharts';

/** Each line has its own dash and marker as well as its own shade, so none relies on colour alone. */
type Shape = 'circle' | 'square' | 'diamond';
export interface LineStyle { key: string; name: string; stroke: string; dash?: string; dot: Shape }

function Marker({ cx, cy, shape, stroke }: { cx?: number; cy?: number; shape: Shape; stroke: string }) {
  if (cx === undefined || cy === undefined) return null;
  const common = { fill: 'var(--color-card)', stroke, strokeWidth: 2 };
  if (shape === 'square') return <rect x={cx - 4.5} y={cy - 4.5} width={9} height={9} {...common} />;
  if (shape === 'diamond') return <path d={`M${cx} ${cy - 6} L${cx + 6} ${cy} L${cx} ${cy + 6} L${cx - 6} ${cy} Z`} {...common} />;
  return <circle cx={cx} cy={cy} r={5} {...common} />;
}

/** A line chart of a player's exchanges, drawn for sighted readers; the page gives the same figures as a table. */
export function ProgressChart({ data, lines, unit, domain }: { data: Record<string, string | number>[]; lines: LineStyle[]; unit?: string; domain: [number, number | string] }) {
  return (
    <div aria-hidden="true">
      <LineChart accessibilityLayer={false} responsive style={{ width: '100%', height: 240 }} data={data} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
        <CartesianGrid stroke="#d9d5cc" />
        <XAxis dataKey="label" tick={{ fill: '#1b2430', fontSize: 13 }} />
        <YAxis allowDecimals={false} tick={{ fill: '#1b2430', fontSize: 13 }} width={40} domain={domain} unit={unit} />
        <Tooltip />
        <Legend />
        {lines.map((l) => (
          <Line
            key={l.key}
            type="monotone"
            dataKey={l.key}
            name={l.name}
            stroke={l.stroke}
            strokeWidth={2.5}
            strokeDasharray={l.dash}
            dot={(p: { cx?: number; cy?: number; index?: number }) => <Marker key={`${l.key}-${p.index}`} cx={p.cx} cy={p.cy} shape={l.dot} stroke={l.stroke} />}
            isAnimationActive={false}
          />
        ))}
      </LineChart>
    </div>
  );
}
