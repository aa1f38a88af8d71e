// recharts measures its container with ResizeObserver, which jsdom lacks: a stub that never fires is
// enough when every chart in these tests has a fixed width and height.
export function stubResizeObserver(): void {
  if (typeof globalThis.ResizeObserver !== 'undefined') return;
  globalThis.ResizeObserver = class {
    observe(): void {}
    unobserve(): void {}
    disconnect(): void {}
  };
}
