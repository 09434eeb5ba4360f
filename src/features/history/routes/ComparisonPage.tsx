import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useMe } from '../../../lib/api/auth';
import { useComparison, type ComparisonOf } from '../api/comparisons';
import { DealComparison } from '../components/DealComparison';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { SignInFirst } from '../../../components/ui/SignInFirst';

/** What the URL compares: /compare/lessons/:id, /compare/drills/:id, /compare/exchanges/:id or /compare?seed=… */
function useComparisonOf(): ComparisonOf | null {
  const { kind, id } = useParams();
  const [params] = useSearchParams();
  if (kind === 'lessons' && id) return { lesson: id };
  if (kind === 'drills' && id) return { drill: id };
  if (kind === 'exchanges' && id) return { exchange: id };
  const seed = params.get('seed');
  return seed ? { seed } : null;
}

export function ComparisonPage() {
  const { data: me, isPending: mePending } = useMe();
  const of = useComparisonOf();
  const comparison = useComparison(of ?? { seed: '' }, of !== null);
  if (mePending) return <p role="status">Loading…</p>;
  if (!me) return <SignInFirst />;
  if (!of) return <FormMessage error>Open a comparison from a lesson, a drill or one of your exchanges.</FormMessage>;
  if (comparison.error) {
    return (
      <Card className="mx-auto max-w-lg">
        <h1 className="mb-3 text-title font-semibold">This comparison is not open to you</h1>
        <FormMessage error>{comparison.error.message}</FormMessage>
        <p className="mt-3">
          <Link to="/history">Back to my exchanges</Link>
        </p>
      </Card>
    );
  }
  if (!comparison.data) return <p role="status">Loading the tables…</p>;
  const c = comparison.data;
  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-1">
        <h1 className="text-title font-semibold">Same deal, compared</h1>
        <p className="text-lead">{c.title}</p>
      </header>
      {c.withheld.map((w, i) => (
        <FormMessage key={i}>
          {w.title}: {w.reason}
        </FormMessage>
      ))}
      {c.deals.length === 0 && c.withheld.length === 0 && <p>No table has played this deal to the end yet.</p>}
      {c.deals.map((deal) => (
        <DealComparison key={deal.key} deal={deal} />
      ))}
    </div>
  );
}
