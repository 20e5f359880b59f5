import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { Card } from '../../components/ui/card';
import { LogoMark } from '../../components/ui/logo-mark';

const linkClass = 'inline-flex min-h-12 items-center font-semibold text-primary underline underline-offset-4';

/** What a route shows when it fails: plain words and a way back. */
export function RouteError() {
  const error = useRouteError();
  const notFound = isRouteErrorResponse(error) && error.status === 404;

  return (
    <Card className="mx-auto flex max-w-2xl flex-col items-start gap-4">
      <title>Problem · Loftbench</title>
      <h1 className="text-2xl font-bold">{notFound ? 'Nothing at this address' : 'This page ran into a problem'}</h1>
      <p className="text-lg">
        {notFound
          ? 'The page you asked for does not exist. Check the address, or go back to the hull list.'
          : 'Loftbench hit something it did not expect while showing this page. Reloading often clears it. If it keeps happening, note what you were doing and tell whoever looks after your Loftbench.'}
      </p>
      <div className="flex flex-wrap items-center gap-4">
        {!notFound && <Button onClick={() => window.location.reload()}>Reload page</Button>}
        <Link to="/hulls" className={linkClass}>
          Back to the hull list
        </Link>
      </div>
    </Card>
  );
}

/** The same, for when the page frame itself failed: there is no header, so bring a plain one. */
export function RootError() {
  return (
    <div className="flex min-h-screen flex-col">
      <div className="bg-ink text-white">
        <div className="mx-auto flex max-w-6xl items-center gap-3 px-4 py-3 text-xl font-bold sm:px-6">
          <LogoMark />
          Loftbench
        </div>
      </div>
      <main className="mx-auto w-full max-w-6xl px-4 py-8 sm:px-6">
        <RouteError />
      </main>
    </div>
  );
}
