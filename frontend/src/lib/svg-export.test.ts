import { describe, expect, it } from 'vitest';
import { serializeSvg, standaloneSvg } from './svg-export';

function chart(markup: string): SVGSVGElement {
  const holder = document.createElement('div');
  holder.innerHTML = markup;
  return holder.querySelector('svg')!;
}

describe('standaloneSvg', () => {
  it('copies the chart with namespace, size, view box and a white background, leaving the page element alone', () => {
    const svg = chart('<svg width="300" height="150" class="chart"><circle class="dot" cx="10" cy="10" r="3"></circle></svg>');
    const { node, width, height } = standaloneSvg(svg);
    expect([width, height]).toEqual([300, 150]);
    expect(node.getAttribute('xmlns')).toBe('http://www.w3.org/2000/svg');
    expect(node.getAttribute('viewBox')).toBe('0 0 300 150');
    expect(node.firstElementChild?.tagName).toBe('rect');
    expect(node.firstElementChild?.getAttribute('fill')).toBe('#ffffff');
    expect(node.querySelector('[class]')).toBeNull();
    expect(node.hasAttribute('class')).toBe(false);
    // The chart on the page keeps its classes and has no background added.
    expect(svg.getAttribute('class')).toBe('chart');
    expect(svg.querySelector('rect')).toBeNull();
  });

  it('keeps an existing view box and draws no background when asked', () => {
    const svg = chart('<svg width="200" height="100" viewBox="0 0 400 200"><line x1="0" y1="0" x2="1" y2="1"></line></svg>');
    const { node } = standaloneSvg(svg, { background: null });
    expect(node.getAttribute('viewBox')).toBe('0 0 400 200');
    expect(node.firstElementChild?.tagName).toBe('line');
  });

  it('falls back to 640 × 320 when the chart has no size yet', () => {
    // [practice] jsdom lays nothing out, so the box is 0 × 0 and the fallback applies
    const { width, height } = standaloneSvg(chart('<svg></svg>'));
    expect([width, height]).toEqual([640, 320]);
  });
});

describe('serializeSvg', () => {
  it('answers the text of an SVG file with its XML declaration', () => {
    const { text } = serializeSvg(chart('<svg width="20" height="10"><text>Shared &amp; own</text></svg>'));
    expect(text.startsWith('<?xml version="1.0" encoding="UTF-8"?>\n<svg')).toBe(true);
    expect(text).toContain('Shared &amp; own');
  });
});
