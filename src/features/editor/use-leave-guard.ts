import { useEffect, useRef } from 'react';
import { useBlocker } from 'react-router-dom';

/**
 * While `active` (unsaved changes on an editable budget), leaving the page
 * asks first: the browser's own question on reload or close, the leave dialog
 * on a move inside the app to another page. `allowLeave` lets the next move go
 * without asking (after the first save of a new budget moves to its address).
 */
export function useLeaveGuard(active: boolean) {
  const allowed = useRef(false);
  useEffect(() => {
    if (!active) return;
    const h = (e: BeforeUnloadEvent) => {
      e.preventDefault();
    };
    window.addEventListener('beforeunload', h);
    return () => window.removeEventListener('beforeunload', h);
  }, [active]);

  const blocker = useBlocker(({ currentLocation, nextLocation }) => active && !allowed.current && currentLocation.pathname !== nextLocation.pathname);
  return {
    asking: blocker.state === 'blocked',
    stay: () => blocker.reset?.(),
    leave: () => blocker.proceed?.(),
    allowLeave: () => {
      allowed.current = true;
    },
  };
}
