// The grids' look: AG Grid's Quartz theme with Outturn's paper, ink and rule colours, compact rows.
import { themeQuartz } from 'ag-grid-community';

export const outturnGridTheme = themeQuartz.withParams({
  accentColor: '#16607a',
  backgroundColor: '#fffdf8',
  foregroundColor: '#1d2430',
  borderColor: '#d9d3c5',
  headerBackgroundColor: '#efebe2',
  headerTextColor: '#4a5261',
  oddRowBackgroundColor: '#fbf9f4',
  rowHoverColor: '#f1ede3',
  selectedRowBackgroundColor: '#d7e9ef',
  rangeSelectionBorderColor: '#16607a',
  fontFamily: 'inherit',
  fontSize: 13,
  headerFontSize: 12,
  headerFontWeight: 600,
  rowHeight: 28,
  headerHeight: 32,
  spacing: 5,
  wrapperBorderRadius: 3,
  cellHorizontalPadding: 8,
});
