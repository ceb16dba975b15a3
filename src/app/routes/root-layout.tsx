import { Suspense } from 'react';
import { Outlet, ScrollRestoration } from 'react-router';
import { LoadingNote } from '../../components/ui/notes';
import { Wordmark } from '../../components/layout/wordmark';

export function RootLayout() {
  return (
    <>
      <Suspense fallback={<RootHydrateFallback />}>
        <Outlet />
      </Suspense>
      <ScrollRestoration />
    </>
  );
}

/** Shown while the first page's data loads. */
export function RootHydrateFallback() {
  return (
    <div className="mx-auto max-w-page px-10 pt-6">
      <Wordmark />
      <LoadingNote className="pt-16">Opening Phaseloom…</LoadingNote>
    </div>
  );
}
