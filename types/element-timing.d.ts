// The Element Timing attribute (WICG Element Timing API, implemented in Chromium): marks an element
// whose paint time the browser reports to a PerformanceObserver of type "element". React passes it
// through as written; its DOM types do not list it yet.
import 'react';

declare module 'react' {
  // Merging needs React's own parameter name, unused here.
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface HTMLAttributes<T> {
    elementtiming?: string;
  }
}
