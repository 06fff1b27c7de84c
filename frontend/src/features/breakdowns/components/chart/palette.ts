/**
 * Chart colours come from the palette tokens of index.css. A chart's SVG is also saved as a file,
 * where CSS variables and classes mean nothing, so each token is resolved once to a plain rgb()
 * value by reading the computed colour of a probe element that carries the token's class.
 */
const TOKENS = {
  white: 'text-white',
  text: 'text-ink-900',
  muted: 'text-ink-600',
  axis: 'text-ink-500',
  faint: 'text-ink-400',
  grid: 'text-ink-200',
  primary: 'text-accent-700',
  primaryLight: 'text-accent-300',
  secondary: 'text-caution-700',
  secondaryLight: 'text-caution-200',
  emphasis: 'text-danger-700',
} as const;

export type ChartPalette = Record<keyof typeof TOKENS, string>;

let cached: ChartPalette | null = null;

function toRgb(color: string): string {
  if (!color || /^rgba?\(/.test(color)) return color || 'currentColor';
  // Modern colour spaces (oklch) are converted by painting one pixel and reading it back.
  try {
    const canvas = document.createElement('canvas');
    canvas.width = 1;
    canvas.height = 1;
    const context = canvas.getContext('2d', { willReadFrequently: true });
    if (!context) return color;
    context.fillStyle = color;
    context.fillRect(0, 0, 1, 1);
    const [r, g, b] = context.getImageData(0, 0, 1, 1).data;
    return `rgb(${r ?? 0}, ${g ?? 0}, ${b ?? 0})`;
  } catch {
    return color;
  }
}

function resolve(): ChartPalette {
  const probe = document.createElement('span');
  probe.setAttribute('aria-hidden', 'true');
  probe.style.position = 'absolute';
  probe.style.visibility = 'hidden';
  document.body.append(probe);
  const out = {} as ChartPalette;
  try {
    for (const [name, className] of Object.entries(TOKENS) as [keyof ChartPalette, string][]) {
      probe.className = className;
      out[name] = toRgb(getComputedStyle(probe).color);
    }
  } finally {
    probe.remove();
  }
  return out;
}

/** The chart palette as plain colour values (resolved once per page load). */
export function chartPalette(): ChartPalette {
  if (typeof document === 'undefined') {
    return Object.fromEntries(Object.keys(TOKENS).map((k) => [k, 'currentColor'])) as ChartPalette;
  }
  cached ??= resolve();
  return cached;
}
