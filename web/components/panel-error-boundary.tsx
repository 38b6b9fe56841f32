import { Component, type ErrorInfo, type ReactNode } from 'react';
import { Alert } from './alert';
import { Button } from './button';

interface Props {
  children: ReactNode;
  /** Called when the user presses "Try again", e.g. to reset failed queries. */
  onReset?: () => void;
}
interface State {
  error: Error | null;
}

/** Catches a render error inside one panel so the rest of the page (header, navigation) stays usable. */
export class PanelErrorBoundary extends Component<Props, State> {
  state: State = { error: null };

  static getDerivedStateFromError(error: Error): State {
    return { error };
  }

  componentDidCatch(error: Error, info: ErrorInfo): void {
    console.error('Panel failed to render', error, info.componentStack);
  }

  private reset = () => {
    this.props.onReset?.();
    this.setState({ error: null });
  };

  render() {
    if (!this.state.error) return this.props.children;
    return (
      <Alert tone="error" title="This part of the page stopped working">
        <p>Reload the page or try again. If it keeps happening, tell your administrator.</p>
        <Button variant="secondary" size="sm" className="mt-3" onClick={this.reset}>
          Try again
        </Button>
      </Alert>
    );
  }
}
