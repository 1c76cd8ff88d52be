// Keeps a failure while drawing the figure (e.g. a project the plot core cannot draw) from blanking the whole
// app: the figure area shows the problem, and any later project change tries again.
import { Component, type ErrorInfo, type ReactNode } from "react";

interface Props {
  children: ReactNode;
  /** Changes when the project changes, so a new project gets a new attempt. */
  resetKey: unknown;
}

interface State {
  error: Error | null;
  key: unknown;
}

export class FigureBoundary extends Component<Props, State> {
  override state: State = { error: null, key: undefined };

  static getDerivedStateFromError(error: Error): Partial<State> {
    return { error };
  }

  static getDerivedStateFromProps(props: Props, state: State): Partial<State> | null {
    if (props.resetKey !== state.key) return { key: props.resetKey, error: null };
    return null;
  }

  override componentDidCatch(error: Error, info: ErrorInfo) {
    // Kept visible for bug reports; the user sees the message in the figure area.
    console.warn("axband: the figure could not be drawn", error, info.componentStack);
  }

  override render() {
    if (this.state.error) {
      return (
        <section className="figure-card figure-failed" role="alert" data-testid="plot">
          <p>
            The figure could not be drawn: {this.state.error.message}. Undo the last change, or check the figure
            settings and the imported curves.
          </p>
        </section>
      );
    }
    return this.props.children;
  }
}
