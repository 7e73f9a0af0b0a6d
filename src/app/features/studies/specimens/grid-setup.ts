import {
  CellStyleModule, CheckboxEditorModule, ClientSideRowModelApiModule, ClientSideRowModelModule, ColumnApiModule,
  ModuleRegistry, RenderApiModule, RowApiModule, RowAutoHeightModule, RowSelectionModule, RowStyleModule, ScrollApiModule, TextEditorModule,
  TooltipModule, themeQuartz,
} from 'ag-grid-community';

/**
 * The lean set of grid modules the specimen grid uses (only this chunk loads them): rows and their API,
 * text and checkbox editing, row selection by checkbox, cell and row classes (problems, repeated labels,
 * excluded rows) with their tooltips, rows as tall as a wrapped exclusion reason, refresh.
 */
ModuleRegistry.registerModules([
  ClientSideRowModelModule, ClientSideRowModelApiModule, ColumnApiModule, RowApiModule, RenderApiModule, ScrollApiModule,
  TextEditorModule, CheckboxEditorModule, RowSelectionModule, CellStyleModule, RowStyleModule, RowAutoHeightModule, TooltipModule,
]);

/** Our colours and Open Sans (already loaded by the app; the grid loads no web font of its own). */
export const GRID_THEME = themeQuartz.withParams({
  fontFamily: ['Open Sans', 'system-ui', 'sans-serif'],
  fontSize: 14,
  headerFontWeight: 600,
  accentColor: '#2a6671',
  foregroundColor: '#171d1e',
  backgroundColor: '#ffffff',
  headerBackgroundColor: '#e9eff0',
  oddRowBackgroundColor: '#f5fafb',
  borderColor: '#bfc8ca',
  rowHoverColor: '#eefcff',
  selectedRowBackgroundColor: '#d2f7ff',
  wrapperBorderRadius: 12,
  spacing: 6,
});
