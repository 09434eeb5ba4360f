import { useRef, useState, type DragEvent, type KeyboardEvent } from 'react';
import { tileName, type Tile as TileData } from '../../../shared/tiles';
import { Tile } from './Tile';

export const JOKER_REFUSAL = "Jokers can't be passed. Pick another tile.";

interface RackProps {
  label: string;
  tiles: readonly TileData[];
  picked?: readonly string[];
  received?: readonly string[];
  /** Tiles in a pass already committed. */
  sending?: readonly string[];
  /** Whether tiles can be picked now (a pass is open and not yet committed). */
  canPick?: boolean;
  onPick?: (id: string) => void;
  onCommit?: () => void;
  onClear?: () => void;
  /** Moves a tile to a new place in the rack (drag, or Shift with an arrow key). */
  onMove?: (id: string, to: number) => void;
  /** Something to say aloud (a refusal, a move). */
  onSay?: (message: string) => void;
  size?: 'large' | 'small';
}

function stateWords(picked: boolean, received: boolean, sending: boolean) {
  return [picked && 'picked', received && 'just received', sending && 'in your committed pass'].filter(Boolean).join(', ');
}

/**
 * A rack of tiles in one row: the arrow keys move focus left and right, Space picks or drops a
 * tile, Enter sends the pass, Escape clears the picks, Shift with an arrow moves a tile.
 */
export function Rack({ label, tiles, picked = [], received = [], sending = [], canPick = false, onPick, onCommit, onClear, onMove, onSay, size = 'large' }: RackProps) {
  const [focus, setFocus] = useState(0);
  const buttons = useRef<(HTMLButtonElement | null)[]>([]);
  const dragged = useRef<string | null>(null);
  const current = Math.min(focus, Math.max(0, tiles.length - 1));

  const focusAt = (index: number) => {
    const i = Math.max(0, Math.min(tiles.length - 1, index));
    setFocus(i);
    buttons.current[i]?.focus();
  };

  const pick = (tile: TileData) => {
    if (!canPick) return;
    if (tile.kind === 'joker') {
      onSay?.(JOKER_REFUSAL);
      return;
    }
    onPick?.(tile.id);
  };

  const onKeyDown = (event: KeyboardEvent, index: number) => {
    const tile = tiles[index];
    const step = event.key === 'ArrowRight' ? 1 : event.key === 'ArrowLeft' ? -1 : 0;
    if (step && event.shiftKey && onMove) {
      event.preventDefault();
      const to = Math.max(0, Math.min(tiles.length - 1, index + step));
      onMove(tile.id, to);
      onSay?.(`Moved ${tileName(tile.kind)} to place ${to + 1} of ${tiles.length}.`);
      setFocus(to);
      requestAnimationFrame(() => buttons.current[to]?.focus());
      return;
    }
    if (step) {
      event.preventDefault();
      focusAt(index + step);
    } else if (event.key === 'Home' || event.key === 'End') {
      event.preventDefault();
      focusAt(event.key === 'Home' ? 0 : tiles.length - 1);
    } else if (event.key === ' ') {
      event.preventDefault();
      pick(tile);
    } else if (event.key === 'Enter') {
      event.preventDefault();
      onCommit?.();
    } else if (event.key === 'Escape') {
      event.preventDefault();
      onClear?.();
    }
  };

  const onDrop = (event: DragEvent, index: number) => {
    event.preventDefault();
    if (dragged.current && onMove) onMove(dragged.current, index);
    dragged.current = null;
  };

  const width = size === 'large' ? 'w-11 sm:w-14 lg:w-16' : 'w-8 sm:w-10';
  return (
    <div role="group" aria-label={label} className="flex flex-wrap items-end gap-1 sm:gap-1.5">
      {tiles.map((tile, index) => {
        const isPicked = picked.includes(tile.id);
        const isReceived = received.includes(tile.id);
        const isSending = sending.includes(tile.id);
        const joker = tile.kind === 'joker';
        const words = stateWords(isPicked, isReceived, isSending);
        const tag = isSending ? 'Sending' : isPicked ? 'Picked' : isReceived ? 'New' : '';
        return (
          <button
            key={tile.id}
            ref={(el) => {
              buttons.current[index] = el;
            }}
            type="button"
            tabIndex={index === current ? 0 : -1}
            aria-pressed={canPick ? isPicked : undefined}
            aria-disabled={canPick && joker ? true : undefined}
            aria-label={`${tileName(tile.kind)}${words ? `, ${words}` : ''}${canPick && joker ? ", can't be passed" : ''}`}
            data-tile-id={tile.id}
            draggable={Boolean(onMove)}
            onDragStart={() => {
              dragged.current = tile.id;
            }}
            onDragOver={(e) => e.preventDefault()}
            onDrop={(e) => onDrop(e, index)}
            onFocus={() => setFocus(index)}
            onClick={() => pick(tile)}
            onKeyDown={(e) => onKeyDown(e, index)}
            className={`group flex min-h-6 min-w-6 flex-col items-center rounded-lg border-2 p-0.5 transition-transform duration-150 ${isSending ? 'border-dashed border-ink-soft' : 'border-transparent'} ${isPicked ? '-translate-y-3 bg-picked-soft shadow-[0_0.5rem_0.75rem_-0.25rem_rgb(27_36_48/0.45)]' : ''} ${isReceived && !isPicked ? 'tile-arrive bg-received-soft ring-2 ring-received' : ''}`}
          >
            {/* Picked: the tile is lifted and wears a check mark; the focus ring (an outline with a gap) is another shape and colour. */}
            <span className="relative block">
              <Tile kind={tile.kind} decorative className={width} />
              {isPicked && (
                <span
                  aria-hidden="true"
                  data-testid="picked-check"
                  className="absolute -right-1.5 -top-1.5 flex size-[1.375em] items-center justify-center rounded-full border-2 border-card bg-picked text-xs font-bold leading-none text-white"
                >
                  ✓
                </span>
              )}
            </span>
            <span aria-hidden="true" className={`mt-0.5 h-5 text-xs font-semibold leading-5 ${isPicked ? 'text-picked' : isReceived ? 'text-received' : 'text-ink-soft'}`}>
              {tag && (isPicked ? `✓ ${tag}` : isSending ? `➜ ${tag}` : `● ${tag}`)}
            </span>
          </button>
        );
      })}
    </div>
  );
}
