'use client';
// The pieces of the outcome's own SVG charts: the width of the frame the chart sits in, a linear
// scale, and axes with nice ticks (lib/runs/chart-scale).
import { useLayoutEffect, useRef, useState } from 'react';
import type { Ticks } from '@/lib/runs/chart-scale';
import { linearScale } from '@/lib/brief/chart-geometry';
import { COLORS } from './setup';

/** The measured width of an element (0 until measured, so server and client render alike). */
export function useWidth<T extends HTMLElement>() {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(0);
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    const observer = new ResizeObserver(([entry]) => setWidth(Math.floor(entry.contentRect.width)));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return [ref, width] as const;
}

/** value → pixel, linear from the ticks' [min, max] to [from, to]. */
export const scaleOver = (domain: { min: number; max: number }, from: number, to: number) =>
  linearScale(domain.min, domain.max, from, to);

export const INK = { text: COLORS.inkSoft, faint: '#7b8190', rule: COLORS.rule, grid: '#ebe6da' };

/** A horizontal axis along y = at, its ticks labelled by `format`, with its title below. */
export function BottomAxis({
  ticks,
  x,
  at,
  left,
  right,
  format,
  title,
}: {
  ticks: Ticks;
  x: (v: number) => number;
  at: number;
  left: number;
  right: number;
  format: (v: number) => string;
  title?: string;
}) {
  return (
    <g fontSize={11} fill={INK.text}>
      <line x1={left} x2={right} y1={at} y2={at} stroke={INK.rule} />
      {ticks.values.map((v) => {
        const label = format(v);
        // A label that would run past the plot's end is set flush with it, never cut.
        const half = label.length * 3.3;
        const anchor = x(v) + half > right + 10 ? 'end' : x(v) - half < left - 40 ? 'start' : 'middle';
        return (
          <g key={v}>
            <line x1={x(v)} x2={x(v)} y1={at} y2={at + 4} stroke={INK.rule} />
            <text x={anchor === 'end' ? Math.min(x(v), right + 10) : x(v)} y={at + 16} textAnchor={anchor}>
              {label}
            </text>
          </g>
        );
      })}
      {title ? (
        <text x={(left + right) / 2} y={at + 32} textAnchor="middle" fill={INK.faint}>
          {title}
        </text>
      ) : null}
    </g>
  );
}

/** A vertical axis along x = at with light grid lines across to `right`, its title turned up. */
export function LeftAxis({
  ticks,
  y,
  at,
  right,
  format,
  title,
}: {
  ticks: Ticks;
  y: (v: number) => number;
  at: number;
  right: number;
  format: (v: number) => string;
  title?: string;
}) {
  const top = Math.min(...ticks.values.map(y));
  const bottom = Math.max(...ticks.values.map(y));
  return (
    <g fontSize={11} fill={INK.text}>
      {ticks.values.map((v) => (
        <g key={v}>
          <line x1={at} x2={right} y1={y(v)} y2={y(v)} stroke={INK.grid} />
          <text x={at - 6} y={y(v) + 4} textAnchor="end">
            {format(v)}
          </text>
        </g>
      ))}
      {title ? (
        <text
          transform={`translate(12 ${(top + bottom) / 2}) rotate(-90)`}
          textAnchor="middle"
          fill={INK.faint}
        >
          {title}
        </text>
      ) : null}
    </g>
  );
}
