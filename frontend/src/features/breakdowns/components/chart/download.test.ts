import { describe, expect, it } from 'vitest';
import { fileSlug, serializeChartSvg } from './download';

describe('serializeChartSvg', () => {
  it('makes a standalone file: namespace, size, title above the chart, and the page element untouched', () => {
    const holder = document.createElement('div');
    holder.innerHTML = '<svg width="200" height="100" class="chart"><circle cx="10" cy="10" r="3"></circle></svg>';
    const svg = holder.querySelector('svg')!;
    const { text, width, height } = serializeChartSvg(svg, 'Error by mode & sponsor');
    expect(width).toBe(200);
    // [practice] a 28-pixel band holds the title above the chart
    expect(height).toBe(128);
    expect(text.startsWith('<?xml version="1.0" encoding="UTF-8"?>\n<svg')).toBe(true);
    expect(text).toContain('xmlns="http://www.w3.org/2000/svg"');
    expect(text).toContain('viewBox="0 0 200 128"');
    expect(text).toContain('<title>Error by mode &amp; sponsor</title>');
    expect(text).toMatch(/<g transform="translate\(0, 28\)"><circle/);
    expect(text).not.toContain('class="chart"');
    // The chart on the page keeps its own size and children.
    expect(svg.getAttribute('height')).toBe('100');
    expect(svg.querySelectorAll('circle')).toHaveLength(1);
    expect(svg.querySelector('title')).toBeNull();
  });
});

describe('fileSlug', () => {
  it('keeps lower-case letters and digits joined by dashes', () => {
    expect(fileSlug('Halloway & Finch: lean per election')).toBe('halloway-finch-lean-per-election');
    expect(fileSlug('Q–Q plot of signed errors')).toBe('q-q-plot-of-signed-errors');
    expect(fileSlug('***')).toBe('chart');
  });
});
