import { useRouteError } from 'react-router-dom';
import { Button } from './Button';
import { Card } from './Card';

/** Shown when a page fails to load or draw, for instance an old tab after Rackside was updated. */
export function RouteErrorPage() {
  const error = useRouteError();
  console.error(error);
  return (
    <main id="main" className="mx-auto w-full max-w-5xl px-4 py-8">
      <Card className="mx-auto max-w-lg">
        <h1 className="mb-3 text-title font-semibold">This page could not load</h1>
        <p className="mb-4">Rackside may have been updated since this tab opened. Reloading usually fixes it; your tables and passes are kept.</p>
        <Button kind="primary" onClick={() => window.location.reload()}>
          Reload the page
        </Button>
      </Card>
    </main>
  );
}
