import type { Group } from '../../../../shared/analysis/pattern';
import { tileName } from '../../../../shared/tiles';
import { exampleFor, exampleKind, exampleWords, groupWords } from '../pattern-example';
import { Tile } from '../../../components/ui/Tile';

/** A pattern drawn as tiles, group by group, with the example values it is shown with. */
export function PatternTiles({ groups, size = 'w-8' }: { groups: readonly Group[]; size?: string }) {
  const example = exampleFor(groups);
  const caption = exampleWords({ groups: [...groups] }, example);
  return (
    <div className="flex flex-col gap-1">
      <ol className="flex flex-wrap items-end gap-3" aria-label="The pattern as tiles">
        {groups.map((group, i) => {
          const kind = exampleKind(group, example);
          const words = groupWords(group);
          return (
            <li key={i} className="flex flex-col items-start gap-0.5">
              <span role="img" aria-label={`Group ${i + 1}: ${words}${kind ? `, shown as ${tileName(kind)}` : ''}`} className="flex gap-0.5">
                {Array.from({ length: Math.max(0, Math.min(group.size, 6)) }, (_, k) =>
                  kind ? (
                    <Tile key={k} kind={kind} decorative className={size} />
                  ) : (
                    <span key={k} className={`${size} flex aspect-[3/4] items-center justify-center rounded-md border-2 border-dashed border-line text-sm`} aria-hidden="true">
                      ?
                    </span>
                  ),
                )}
              </span>
              <span className="text-sm text-ink-soft" aria-hidden="true">
                {words}
              </span>
            </li>
          );
        })}
      </ol>
      {caption && <p className="text-sm text-ink-soft">{caption}.</p>}
    </div>
  );
}
