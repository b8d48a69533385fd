import { useNavigation } from "react-router";

/**
 * A thin bar across the top of the window while the next screen's code or data is on its way (the current screen
 * stays until then). It fades in after a moment, so quick moves do not flash it.
 */
export function NavigationProgress() {
  const loading = useNavigation().state !== "idle";
  if (!loading) return null;
  return (
    <div role="progressbar" aria-label="Opening the next screen" className="nav-progress fixed inset-x-0 top-0 z-50 h-1 overflow-hidden bg-candy-100">
      <div className="nav-progress-bar h-full w-1/3 bg-candy-600" />
    </div>
  );
}
