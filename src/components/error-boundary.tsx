import { Component, type ErrorInfo, type ReactNode } from "react";
import { ErrorNotice } from "./feedback";

/** Keeps one failing panel from taking the whole page down. */
export class ErrorBoundary extends Component<
  { children: ReactNode; title?: string },
  { error: unknown }
> {
  state: { error: unknown } = { error: null };

  static getDerivedStateFromError(error: unknown) {
    return { error };
  }

  componentDidCatch(error: unknown, info: ErrorInfo) {
    console.error("Panel failed", error, info.componentStack);
  }

  render() {
    if (this.state.error) {
      return (
        <ErrorNotice
          error={this.state.error}
          title={this.props.title ?? "This panel failed to draw"}
          onRetry={() => this.setState({ error: null })}
        />
      );
    }
    return this.props.children;
  }
}
