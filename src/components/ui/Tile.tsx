import type { ReactNode } from 'react';
import { rankOf, suitOf, tileName, type DragonKind, type TileKind, type WindKind } from '../../../shared/tiles';
import { DRAGON_COLOURS, SUIT_COLOURS, TILE_EDGE, TILE_FACE, TILE_INK } from './palette';

/** Our own faces: an index in the top-left corner, a mark of our own in the middle. All drawn on a 60 × 80 grid. */

const GRID = { x: [20, 32, 44], y: [40, 53, 66] };
/** Which cells of a 3 × 3 grid hold a ring, for each number of dots. */
const DOT_CELLS: Record<number, [number, number][]> = {
  1: [[1, 1]],
  2: [[0, 0], [2, 2]],
  3: [[0, 0], [1, 1], [2, 2]],
  4: [[0, 0], [2, 0], [0, 2], [2, 2]],
  5: [[0, 0], [2, 0], [1, 1], [0, 2], [2, 2]],
  6: [[0, 0], [2, 0], [0, 1], [2, 1], [0, 2], [2, 2]],
  7: [[0, 0], [2, 0], [0, 1], [1, 1], [2, 1], [0, 2], [2, 2]],
  8: [[0, 0], [1, 0], [2, 0], [0, 1], [2, 1], [0, 2], [1, 2], [2, 2]],
  9: [[0, 0], [1, 0], [2, 0], [0, 1], [1, 1], [2, 1], [0, 2], [1, 2], [2, 2]],
};

function Rings({ n, colour }: { n: number; colour: string }) {
  return (
    <g fill="none" stroke={colour} strokeWidth={2.6}>
      {DOT_CELLS[n].map(([c, r]) => (
        <circle key={`${c}-${r}`} cx={GRID.x[c]} cy={GRID.y[r]} r={n === 1 ? 11 : 5} />
      ))}
      {n === 1 && <circle cx={GRID.x[1]} cy={GRID.y[1]} r={4} fill={colour} stroke="none" />}
    </g>
  );
}

function Sticks({ n, colour }: { n: number; colour: string }) {
  const rows = n <= 4 ? [n] : [Math.ceil(n / 2), Math.floor(n / 2)];
  const height = rows.length === 1 ? 34 : 16;
  return (
    <g fill={colour}>
      {rows.flatMap((count, row) => {
        const gap = 40 / count;
        const top = rows.length === 1 ? 36 : 34 + row * 20;
        return Array.from({ length: count }, (_, i) => (
          <rect key={`${row}-${i}`} x={12 + gap * i + gap / 2 - 2.5} y={top} width={5} height={height} rx={2.5} />
        ));
      })}
    </g>
  );
}

/** A bold numeral standing clear, with a fissure (a zigzag) of our own beside it, never across it. */
function CrackedNumeral({ n, colour }: { n: number; colour: string }) {
  return (
    <g>
      <text x={25} y={67} textAnchor="middle" fontSize={32} fontWeight={800} fill={colour} fontFamily="Work Sans, system-ui, sans-serif">
        {n}
      </text>
      <polyline
        data-mark="crack"
        points="47,36 42,44 50,51 42,58 50,65 45,73"
        fill="none"
        stroke={colour}
        strokeWidth={3.2}
        strokeLinecap="round"
        strokeLinejoin="round"
      />
    </g>
  );
}

const WIND_ANGLE: Record<WindKind, number> = { 'wind-n': 0, 'wind-e': 90, 'wind-s': 180, 'wind-w': 270 };
const WIND_LETTER: Record<WindKind, string> = { 'wind-n': 'N', 'wind-e': 'E', 'wind-s': 'S', 'wind-w': 'W' };

function Compass({ kind }: { kind: WindKind }) {
  return (
    <g>
      <circle cx={32} cy={54} r={13} fill="none" stroke={TILE_INK} strokeWidth={2.4} />
      <path d="M32 33 l6 9 h-12 z" fill={TILE_INK} transform={`rotate(${WIND_ANGLE[kind]} 32 54)`} />
      <text x={32} y={60.5} textAnchor="middle" fontSize={17} fontWeight={700} fill={TILE_INK}>
        {WIND_LETTER[kind]}
      </text>
    </g>
  );
}

function DragonMark({ kind }: { kind: DragonKind }) {
  const colour = DRAGON_COLOURS[kind];
  if (kind === 'dragon-red') return <path d="M32 34 L48 54 L32 74 L16 54 Z" fill={colour} />;
  if (kind === 'dragon-green') return <path d="M32 35 L50 71 H14 Z" fill={colour} />;
  return (
    <g fill="none" stroke={colour}>
      <rect x={15} y={37} width={34} height={34} rx={3} strokeWidth={3.2} />
      <rect x={22} y={44} width={20} height={20} rx={2} strokeWidth={2} />
    </g>
  );
}

function Petals() {
  return (
    <g fill="none" stroke={TILE_INK} strokeWidth={2.2}>
      {[0, 72, 144, 216, 288].map((a) => (
        <ellipse key={a} cx={32} cy={45} rx={5.5} ry={10} transform={`rotate(${a} 32 54)`} />
      ))}
      <circle cx={32} cy={54} r={3.5} fill={TILE_INK} />
    </g>
  );
}

function Star() {
  const points = Array.from({ length: 10 }, (_, i) => {
    const r = i % 2 === 0 ? 19 : 8;
    const a = (Math.PI / 5) * i - Math.PI / 2;
    return `${(32 + r * Math.cos(a)).toFixed(1)},${(55 + r * Math.sin(a)).toFixed(1)}`;
  }).join(' ');
  return <polygon points={points} fill={TILE_INK} />;
}

const SUIT_LETTER = { bam: 'B', crack: 'C', dot: 'D' } as const;
const DRAGON_INDEX: Record<DragonKind, string> = { 'dragon-red': 'R', 'dragon-green': 'G', 'dragon-white': 'Wh' };

function face(kind: TileKind): { index: string; sub?: string; colour: string; mark: ReactNode } {
  const suit = suitOf(kind);
  if (suit) {
    const n = rankOf(kind)!;
    const colour = SUIT_COLOURS[suit];
    const mark = suit === 'dot' ? <Rings n={n} colour={colour} /> : suit === 'bam' ? <Sticks n={n} colour={colour} /> : <CrackedNumeral n={n} colour={colour} />;
    return { index: String(n), sub: SUIT_LETTER[suit], colour, mark };
  }
  if (kind.startsWith('wind-')) return { index: WIND_LETTER[kind as WindKind], colour: TILE_INK, mark: <Compass kind={kind as WindKind} /> };
  if (kind.startsWith('dragon-')) return { index: DRAGON_INDEX[kind as DragonKind], colour: DRAGON_COLOURS[kind as DragonKind], mark: <DragonMark kind={kind as DragonKind} /> };
  if (kind === 'flower') return { index: 'F', colour: TILE_INK, mark: <Petals /> };
  return { index: 'J', colour: TILE_INK, mark: <Star /> };
}

interface TileProps {
  kind: TileKind;
  /** Inside a control that already names the tile. */
  decorative?: boolean;
  className?: string;
}

export function Tile({ kind, decorative = false, className = '' }: TileProps) {
  const { index, sub, colour, mark } = face(kind);
  const label = decorative ? {} : { role: 'img', 'aria-label': tileName(kind) };
  return (
    <svg viewBox="0 0 60 80" className={`block h-auto ${className}`} aria-hidden={decorative || undefined} {...label} data-kind={kind}>
      <rect x={1.5} y={1.5} width={57} height={77} rx={7} fill={TILE_FACE} stroke={TILE_EDGE} strokeWidth={2} />
      <text x={6} y={21} fontSize={index.length > 1 ? 15 : 20} fontWeight={800} fill={colour} fontFamily="Work Sans, system-ui, sans-serif">
        {index}
      </text>
      {sub && (
        <text x={7} y={32} fontSize={10} fontWeight={700} fill={colour} fontFamily="Work Sans, system-ui, sans-serif">
          {sub}
        </text>
      )}
      {mark}
    </svg>
  );
}
