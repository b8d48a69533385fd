import { useEffect, useRef } from "react";
import { useLocation } from "react-router";

/** After moving to another page, put keyboard and screen-reader focus at the start of the new content. */
export function useFocusMainOnNavigate() {
  const { pathname } = useLocation();
  const mainRef = useRef<HTMLElement>(null);
  const first = useRef(true);
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    mainRef.current?.focus({ preventScroll: true });
    window.scrollTo({ top: 0 });
  }, [pathname]);
  return mainRef;
}
