import { Component, type ErrorInfo, type ReactNode } from "react";

type Props = {
  children: ReactNode;
  fallback: (props: { error: unknown; reset: () => void }) => ReactNode;
  /** When any of these change (e.g. the location), a shown error is cleared. */
  resetKeys?: unknown[];
  onReset?: () => void;
};
type State = { error: unknown; keys: unknown[] | undefined };

/** Catches render errors below it (including server errors thrown by queries) and shows `fallback`. */
export class ErrorBoundary extends Component<Props, State> {
  state: State = { error: null, keys: this.props.resetKeys };

  static getDerivedStateFromError(error: unknown): Partial<State> {
    return { error };
  }

  static getDerivedStateFromProps(props: Props, state: State): Partial<State> | null {
    const changed =
      (props.resetKeys?.length ?? 0) !== (state.keys?.length ?? 0) || (props.resetKeys ?? []).some((k, i) => !Object.is(k, state.keys?.[i]));
    if (!changed) return null;
    return { keys: props.resetKeys, ...(state.error ? { error: null } : {}) };
  }

  componentDidCatch(error: unknown, info: ErrorInfo) {
    console.error("Screen error:", error, info.componentStack);
  }

  reset = () => {
    this.props.onReset?.();
    this.setState({ error: null });
  };

  render() {
    if (this.state.error) return this.props.fallback({ error: this.state.error, reset: this.reset });
    return this.props.children;
  }
}
