import { ChangeDetectionStrategy, Component, ViewEncapsulation } from '@angular/core';

/**
 * Print rules for the study pages: on paper only the page itself shows, without the navigation, the
 * toolbar or any button, and the content uses the whole width. Global on purpose (encapsulation None),
 * present only while a study page is.
 */
@Component({
  selector: 'app-print-layout',
  changeDetection: ChangeDetectionStrategy.OnPush,
  encapsulation: ViewEncapsulation.None,
  template: '',
  styles: `
    @media print {
      app-shell mat-toolbar,
      app-shell mat-sidenav,
      .no-print,
      .mat-mdc-button-base,
      .mat-mdc-paginator,
      .mat-mdc-snack-bar-container {
        display: none !important;
      }
      app-shell,
      app-shell .mat-drawer-container,
      app-shell .mat-drawer-content {
        display: block !important;
        height: auto !important;
        overflow: visible !important;
        margin-left: 0 !important;
      }
      .page {
        max-width: none !important;
        padding: 0 !important;
      }
    }
  `,
})
export class PrintLayout {}
