import { Link } from 'react-router-dom';

export function NotFoundRoute() {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <p className="text-sm font-semibold uppercase tracking-wider text-ink-faint">404</p>
      <h1 className="mt-2 text-2xl font-bold">There is no page here</h1>
      <p className="mt-2 text-ink-soft">The address may be mistyped, or the page was moved.</p>
      <Link to="/" className="mt-6 inline-block font-semibold text-copper underline underline-offset-4">
        Back to the workbench
      </Link>
    </div>
  );
}
