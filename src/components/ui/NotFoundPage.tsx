import { Link } from 'react-router-dom';
import { Card } from './Card';

export function NotFoundPage() {
  return (
    <Card className="mx-auto max-w-lg">
      <h1 className="mb-3 text-title font-semibold">This page is not here</h1>
      <p className="mb-4">The address may be mistyped, or the page has moved.</p>
      <Link to="/">Back to the home page</Link>
    </Card>
  );
}
