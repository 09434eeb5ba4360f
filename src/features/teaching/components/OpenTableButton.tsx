import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import type { DrillDto } from '../../../../shared/drills';
import { Button } from '../../../components/ui/Button';
import { FormMessage } from '../../../components/ui/FormMessage';
import { useCreateTable } from '../../../lib/api/tables';

/** "Open a table with this drill": one click, then the table page. */
export function OpenTableButton({ drill }: { drill: Pick<DrillDto, 'id' | 'name'> }) {
  const navigate = useNavigate();
  const create = useCreateTable();
  const [problem, setProblem] = useState('');
  return (
    <div className="flex flex-col gap-1">
      <Button
        kind="primary"
        disabled={create.isPending}
        onClick={() => {
          setProblem('');
          create.mutate({ name: drill.name, drillId: drill.id }, { onSuccess: (table) => navigate(`/tables/${table.id}`), onError: (err) => setProblem(err.message) });
        }}
      >
        {create.isPending ? 'Opening…' : 'Open a table with this drill'}
      </Button>
      {problem && <FormMessage error>{problem}</FormMessage>}
    </div>
  );
}
