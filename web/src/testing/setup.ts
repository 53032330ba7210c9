/**
 * Browser features antd and the router use that jsdom does not have
 * (toolchain.md, "Web tests with antd in jsdom").
 */
import '@testing-library/jest-dom';
import { configure } from '@testing-library/react';

// The first render of a file loads its lazy route modules (and antd) cold:
// on a shared two-core machine that can take a few seconds.
configure({ asyncUtilTimeout: 5000 });

// antd's responsive grid and breakpoints. false: narrow-screen-only columns stay hidden.
Object.defineProperty(window, 'matchMedia', {
  writable: true,
  value: (query: string) => ({
    matches: false,
    media: query,
    onchange: null,
    addListener: () => undefined,
    removeListener: () => undefined,
    addEventListener: () => undefined,
    removeEventListener: () => undefined,
    dispatchEvent: () => false,
  }),
});

class ResizeObserverStub {
  observe() {}
  unobserve() {}
  disconnect() {}
}
Object.defineProperty(window, 'ResizeObserver', { writable: true, value: ResizeObserverStub });

/**
 * getComputedStyle from inline styles only. jsdom's real one matches every
 * rule of antd's large injected stylesheet on each call (user-event and
 * role queries call it for every element), which made one click cost
 * seconds. So in tests, class-based CSS (e.g. a hidden popup's class) is not
 * applied: assert that elements are present or absent, not CSS visibility.
 * This also covers the pseudo-element calls jsdom does not implement.
 */
window.getComputedStyle = ((elt: Element) =>
  (elt as HTMLElement).style ?? document.createElement('div').style) as typeof window.getComputedStyle;

// The router's scroll restoration; jsdom logs "Not implemented: window.scrollTo".
window.scrollTo = (() => undefined) as typeof window.scrollTo;

/**
 * antd's form batches watchers through a MessageChannel "macro task"; jsdom
 * has none, and Node's keeps the test process alive once a port listens.
 * A timer gives the same ordering (after the current task) and lets go.
 */
class TimerMessagePort {
  onmessage: ((e: { data: unknown }) => void) | null = null;
  other: TimerMessagePort | null = null;
  postMessage(data: unknown) {
    const target = this.other;
    setTimeout(() => target?.onmessage?.({ data }), 0);
  }
  close() {
    this.onmessage = null;
  }
}
class TimerMessageChannel {
  port1 = new TimerMessagePort();
  port2 = new TimerMessagePort();
  constructor() {
    this.port1.other = this.port2;
    this.port2.other = this.port1;
  }
}
Object.defineProperty(window, 'MessageChannel', { writable: true, value: TimerMessageChannel });
