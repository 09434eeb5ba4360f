import type { DrillDto } from '../../../../shared/drills';
import { SEATS } from '../../../../shared/seats';
import { useDrills } from '../../../lib/api/drill-list';
import { drillExportUrl, useImportDrill } from '../api/drills';
import { OpenTableButton } from '../components/OpenTableButton';
import { Card } from '../../../components/ui/Card';
import { FileImport } from '../components/FileImport';
import { FormMessage } from '../../../components/ui/FormMessage';
import { DownloadLink, LinkButton } from '../../../components/ui/LinkButton';
import { TeacherOnly } from '../../../components/ui/TeacherOnly';

export function partsWords(d: Pick<DrillDto, 'secondCharleston' | 'courtesy' | 'jokers'>) {
  return [
    'first Charleston',
    d.secondCharleston ? 'second Charleston offered' : 'no second Charleston',
    d.courtesy ? 'courtesy pass' : 'no courtesy pass',
    d.jokers ? 'with jokers' : 'no jokers',
  ].join(' · ');
}

function presetWords(d: DrillDto) {
  const seats = SEATS.filter((s) => d.racks[s]?.length).map((s) => `${s} ${d.racks[s]!.length}`);
  return seats.length ? `Preset tiles: ${seats.join(', ')}` : 'No preset tiles: every rack is dealt from the seed';
}

function DrillCard({ drill }: { drill: DrillDto }) {
  return (
    <li>
      <Card className="flex flex-col gap-3">
        <h2 className="text-lead font-semibold">{drill.name}</h2>
        {drill.description && <p>{drill.description}</p>}
        <dl className="grid gap-x-4 gap-y-1 text-base sm:grid-cols-[max-content_1fr]">
          <dt className="text-ink-soft">Seed</dt>
          <dd className="break-all font-medium">{drill.seed}</dd>
          <dt className="text-ink-soft">Parts</dt>
          <dd>{partsWords(drill)}</dd>
          <dt className="text-ink-soft">Racks</dt>
          <dd>{presetWords(drill)}</dd>
          <dt className="text-ink-soft">Pattern list</dt>
          <dd>{drill.patternListName}</dd>
        </dl>
        <div className="flex flex-wrap gap-3">
          <OpenTableButton drill={drill} />
          <LinkButton to={`/drills/${drill.id}`} aria-label={`Edit ${drill.name}`}>
            Edit
          </LinkButton>
          <DownloadLink href={drillExportUrl(drill.id)} aria-label={`Download ${drill.name} as a drill file`}>
            Download
          </DownloadLink>
        </div>
      </Card>
    </li>
  );
}

function Drills() {
  const drills = useDrills();
  const importDrill = useImportDrill();
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-title font-semibold">Drills</h1>
        <LinkButton kind="primary" to="/drills/new">
          New drill
        </LinkButton>
      </div>
      <p>A drill is a deal you can run again and again: a seed, tiles you pick for any seat, and the parts of the Charleston to play.</p>
      {drills.error && <FormMessage error>{drills.error.message}</FormMessage>}
      {drills.isPending && <p role="status">Loading your drills…</p>}
      {drills.data?.length === 0 && <p>No drills yet. Make one, or import a drill file.</p>}
      <ul className="flex flex-col gap-4">
        {drills.data?.map((d) => (
          <DrillCard key={d.id} drill={d} />
        ))}
      </ul>
      <Card>
        <FileImport
          label="Import a drill file"
          hint="A Rackside drill file (.json, up to 256 KB), as Download makes it."
          accept=".json,application/json"
          onImport={async (file) => {
            const { drill, notes } = await importDrill.mutateAsync(file);
            return [`Imported “${drill.name}”.`, ...notes].join(' ');
          }}
        />
      </Card>
    </div>
  );
}

export function DrillsPage() {
  return (
    <TeacherOnly what="Drills">
      <Drills />
    </TeacherOnly>
  );
}
