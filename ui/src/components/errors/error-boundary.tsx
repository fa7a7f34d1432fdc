import { Component, type ErrorInfo, type ReactNode } from 'react';

interface Props {
  /** what to show instead of the children once they have thrown */
  fallback: (error: Error) => ReactNode;
  children: ReactNode;
}

/** Keeps one failing panel (a chart, say) from taking the whole page down. */
export class ErrorBoundary extends Component<Props, { error: Error | null }> {
  state: { error: Error | null } = { error: null };

  static getDerivedStateFromError(error: Error) {
    return { error };
  }

  componentDidCatch(error: Error, info: ErrorInfo) {
    console.error('A panel failed to render', error, info.componentStack);
  }

  render() {
    return this.state.error ? this.props.fallback(this.state.error) : this.props.children;
  }
}
