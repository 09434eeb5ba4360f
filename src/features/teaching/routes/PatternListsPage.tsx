import { useNavigate } from 'react-router-dom';
import { READ_ONLY_NOTE, type PatternListSummaryDto } from '../../../../shared/pattern-lists';
import { patternListExportUrl, useCopyPatternList, useImportPatternList, usePatternLists } from '../api/pattern-lists';
import { Button } from '../../../components/ui/Button';
import { Card } from '../../../components/ui/Card';
import { FileImport } from '../components/FileImport';
import { FormMessage } from '../../../components/ui/FormMessage';
import { DownloadLink, LinkButton } from '../../../components/ui/LinkButton';
import { TeacherOnly } from '../../../components/ui/TeacherOnly';
import { patternsWord } from '../../../lib/phase-words';

function ListRow({ list }: { list: PatternListSummaryDto }) {
  const navigate = useNavigate();
  const copy = useCopyPatternList();
  return (
    <li>
      <Card className="flex flex-col gap-3">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 className="text-lead font-semibold">{list.name}</h2>
          <span className="rounded-md bg-paper px-2 text-base font-semibold">
            {patternsWord(list.patternCount)}
            {list.readOnly ? ' · read-only' : ''}
          </span>
        </div>
        {(list.description || list.readOnly) && <p>{[list.description, list.readOnly ? READ_ONLY_NOTE : ''].filter(Boolean).join(' ')}</p>}
        <div className="flex flex-wrap gap-3">
          <LinkButton to={`/pattern-lists/${list.id}`} aria-label={`${list.readOnly ? 'View' : 'Edit'} ${list.name}`}>
            {list.readOnly ? 'View' : 'Edit'}
          </LinkButton>
          <Button
            kind={list.readOnly ? 'primary' : 'plain'}
            disabled={copy.isPending}
            aria-label={`Copy ${list.name} into a new list`}
            onClick={() => copy.mutate({ id: list.id }, { onSuccess: (made) => navigate(`/pattern-lists/${made.id}`) })}
          >
            {copy.isPending ? 'Copying…' : 'Copy'}
          </Button>
          <DownloadLink href={patternListExportUrl(list.id, 'json')} aria-label={`Download ${list.name} as JSON`}>
            JSON
          </DownloadLink>
          <DownloadLink href={patternListExportUrl(list.id, 'csv')} aria-label={`Download ${list.name} as CSV`}>
            CSV
          </DownloadLink>
        </div>
        {copy.error && <FormMessage error>{copy.error.message}</FormMessage>}
      </Card>
    </li>
  );
}

function PatternLists() {
  const lists = usePatternLists();
  const importList = useImportPatternList();
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-title font-semibold">Pattern lists</h1>
        <LinkButton kind="primary" to="/pattern-lists/new">
          New list
        </LinkButton>
      </div>
      <p>The hands a table’s analysis and bots aim for. The starter list is Rackside’s own; copy it to make one you can change, or start from nothing.</p>
      {lists.error && <FormMessage error>{lists.error.message}</FormMessage>}
      {lists.isPending && <p role="status">Loading your lists…</p>}
      <ul className="flex flex-col gap-4">
        {lists.data?.map((l) => (
          <ListRow key={l.id} list={l} />
        ))}
      </ul>
      <Card>
        <FileImport
          label="Import a pattern list"
          hint="A Rackside pattern-list file, JSON or CSV, up to 256 KB. Every pattern is checked; a file with a problem is not imported."
          accept=".json,.csv,application/json,text/csv"
          onImport={async (file) => {
            const list = await importList.mutateAsync(file);
            // The link is part of the success, so the next import, failed or not, takes it away.
            return (
              <>
                <p>{`Imported “${list.name}” with ${patternsWord(list.patternCount)}.`}</p>
                <LinkButton to={`/pattern-lists/${list.id}`}>Open the imported list</LinkButton>
              </>
            );
          }}
        />
      </Card>
    </div>
  );
}

export function PatternListsPage() {
  return (
    <TeacherOnly what="Pattern lists">
      <PatternLists />
    </TeacherOnly>
  );
}
