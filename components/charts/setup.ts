'use client';

// Chart.js pieces used by Outturn's charts, registered once, and the shared look.
import {
  BarController,
  BarElement,
  CategoryScale,
  Chart as ChartJS,
  Filler,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  ScatterController,
  Tooltip,
} from 'chart.js';

ChartJS.register(BarController, BarElement, CategoryScale, Filler, Legend, LinearScale);
ChartJS.register(LineController, LineElement, PointElement, ScatterController, Tooltip);
ChartJS.defaults.font.family = 'var(--font-inter), system-ui, sans-serif';
ChartJS.defaults.font.size = 11;
ChartJS.defaults.color = '#4a5261';
ChartJS.defaults.borderColor = '#e6e1d6';
ChartJS.defaults.animation = false;

export const COLORS = {
  cost: '#16607a',
  costLight: 'rgba(22, 96, 122, 0.28)',
  costBand: 'rgba(22, 96, 122, 0.14)',
  time: '#7a3f86',
  timeLight: 'rgba(122, 63, 134, 0.28)',
  timeBand: 'rgba(122, 63, 134, 0.14)',
  caution: '#b7791f',
  ink: '#1d2430',
  inkSoft: '#4a5261',
  rule: '#d9d3c5',
  compare: '#b7791f',
};
