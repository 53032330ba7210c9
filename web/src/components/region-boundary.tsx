import { Component, type ErrorInfo, type ReactNode } from 'react';
import { Alert, Button } from 'antd';

interface Props {
  /** Names the region in the message ("the team table"). */
  region: string;
  /** When this value changes (e.g. the location), a failed region tries again. */
  resetKey?: unknown;
  children: ReactNode;
}

interface State {
  error: Error | null;
}

/**
 * Keeps a rendering error inside one page region: the rest of the page (top
 * bar, navigation) stays usable and the message says what failed.
 */
export class RegionBoundary extends Component<Props, State> {
  override state: State = { error: null };

  static getDerivedStateFromError(error: Error): State {
    return { error };
  }

  override componentDidUpdate(prev: Props) {
    if (this.state.error && prev.resetKey !== this.props.resetKey) this.setState({ error: null });
  }

  override componentDidCatch(error: Error, info: ErrorInfo) {
    // The console is where a developer looks; the person sees the alert.
    console.error(`Error in ${this.props.region}:`, error, info.componentStack);
  }

  override render() {
    if (!this.state.error) return this.props.children;
    return (
      <Alert
        type="error"
        showIcon
        title={`Something went wrong in ${this.props.region}`}
        description={
          <>
            <div>{this.state.error.message || 'An unexpected error occurred.'}</div>
            <div>Try again; if it keeps happening, reload the page.</div>
          </>
        }
        action={
          <Button size="small" onClick={() => this.setState({ error: null })}>
            Try again
          </Button>
        }
      />
    );
  }
}
