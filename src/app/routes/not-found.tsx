import { Link } from 'react-router';
import { Wordmark } from '../../components/layout/wordmark';
import { paths } from '../../config/paths';

/** Any address that leads nowhere. */
export function NotFoundRoute() {
  return (
    <main id="main" className="mx-auto max-w-[44rem] px-10 pt-24">
      <title>Not found · Phaseloom</title>
      <Wordmark />
      <h1 className="mt-12 text-2xl font-semibold tracking-tight">Nothing at this address</h1>
      <p className="mt-2 text-ink-soft">
        The link may be old or mistyped. <Mono404 />
      </p>
      <p className="mt-8">
        <Link to={paths.benches.list.getHref()} className="font-medium text-accent underline-offset-4 hover:underline">
          Go to your benches
        </Link>
      </p>
    </main>
  );
}

function Mono404() {
  return <span className="font-mono text-sm text-ink-faint">(404)</span>;
}
