import { useNavigation } from 'react-router';

/** A thin moving line at the top while the next page's data loads; announced to screen readers. */
export function NavigationProgress() {
  const navigation = useNavigation();
  const busy = navigation.state !== 'idle';
  return (
    <>
      <div aria-hidden="true" className={busy ? 'nav-progress nav-progress-on' : 'nav-progress'} />
      <span role="status" aria-live="polite" className="sr-only">
        {busy ? 'Loading the page…' : ''}
      </span>
    </>
  );
}
