import { useEffect, useRef, useState, type ReactNode } from 'react';

/**
 * Renders `children` once the place they will take comes within about one
 * screen of the viewport, `placeholder` (of the same size) until then: a heavy
 * piece far down a page (the chart library) then costs nothing while the page
 * first loads. Where the browser cannot tell (no IntersectionObserver), at once.
 */
export function WhenNearView({ placeholder, children }: { placeholder: ReactNode; children: ReactNode }) {
  const ref = useRef<HTMLDivElement>(null);
  const [near, setNear] = useState(() => typeof IntersectionObserver !== 'function');
  useEffect(() => {
    const place = ref.current;
    if (near || !place) return;
    const observer = new IntersectionObserver((entries) => entries.some((e) => e.isIntersecting) && setNear(true), { rootMargin: '100% 0px' });
    observer.observe(place);
    return () => observer.disconnect();
  }, [near]);
  return near ? <>{children}</> : <div ref={ref}>{placeholder}</div>;
}
