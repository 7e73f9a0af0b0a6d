import { Directive, Injectable, NgModule, inject } from '@angular/core';
import { DateAdapter, MAT_DATE_FORMATS, MatDateFormats } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatInput } from '@angular/material/input';
import { isCalendarDay, laboratoryDate } from '@shared/types/lab-time';
import { AuthStore } from '../core/auth/auth-store';

/**
 * Date fields read and write one form, yyyy-mm-dd, whatever the browser's language: the same form the
 * tables, PDFs and exports print and the API's date filters take. A day is kept as that text itself,
 * so a form control holds "2026-03-29" and never a Date with a browser-local midnight. "Today" is the
 * laboratory's today.
 */
@Injectable()
export class DayDateAdapter extends DateAdapter<string> {
  private readonly auth = inject(AuthStore, { optional: true });

  constructor() {
    super();
    this.setLocale('en-GB');
  }

  getYear(day: string): number {
    return Number(day.slice(0, 4));
  }

  getMonth(day: string): number {
    return Number(day.slice(5, 7)) - 1;
  }

  getDate(day: string): number {
    return Number(day.slice(8, 10));
  }

  getDayOfWeek(day: string): number {
    return utc(day).getUTCDay();
  }

  getMonthNames(style: 'long' | 'short' | 'narrow'): string[] {
    const f = new Intl.DateTimeFormat('en-GB', { month: style, timeZone: 'UTC' });
    return Array.from({ length: 12 }, (_, m) => f.format(Date.UTC(2026, m, 1)));
  }

  getDateNames(): string[] {
    return Array.from({ length: 31 }, (_, i) => String(i + 1));
  }

  /** Sunday first, as the adapter's contract asks (2026-03-01 was a Sunday). */
  getDayOfWeekNames(style: 'long' | 'short' | 'narrow'): string[] {
    const f = new Intl.DateTimeFormat('en-GB', { weekday: style, timeZone: 'UTC' });
    return Array.from({ length: 7 }, (_, d) => f.format(Date.UTC(2026, 2, 1 + d)));
  }

  getYearName(day: string): string {
    return day.slice(0, 4);
  }

  /** Weeks start on Monday (ISO 8601). */
  getFirstDayOfWeek(): number {
    return 1;
  }

  getNumDaysInMonth(day: string): number {
    return new Date(Date.UTC(this.getYear(day), this.getMonth(day) + 1, 0)).getUTCDate();
  }

  clone(day: string): string {
    return day;
  }

  createDate(year: number, month: number, date: number): string {
    const day = `${String(year).padStart(4, '0')}-${String(month + 1).padStart(2, '0')}-${String(date).padStart(2, '0')}`;
    if (!isCalendarDay(day)) throw Error(`There is no day ${date} in month ${month + 1} of ${year}.`);
    return day;
  }

  today(): string {
    return laboratoryDate(new Date(), this.auth?.user()?.laboratory.timeZone ?? 'UTC');
  }

  /** Typed text: a yyyy-mm-dd day, nothing for an empty field, and an invalid day for anything else. */
  parse(value: unknown): string | null {
    if (value === null || value === undefined) return null;
    const text = String(value).trim();
    if (!text) return null;
    return isCalendarDay(text) ? text : this.invalid();
  }

  format(day: string, displayFormat: string): string {
    if (!this.isValid(day)) throw Error('DayDateAdapter: cannot write an invalid day.');
    const at = utc(day);
    switch (displayFormat) {
      case 'month-year': return new Intl.DateTimeFormat('en-GB', { month: 'short', year: 'numeric', timeZone: 'UTC' }).format(at);
      case 'long': return new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(at);
      case 'long-month-year': return new Intl.DateTimeFormat('en-GB', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(at);
      default: return day;
    }
  }

  addCalendarYears(day: string, years: number): string {
    return this.addCalendarMonths(day, years * 12);
  }

  /** Keeps the day of the month where it can (31 March + 1 month = 30 April). */
  addCalendarMonths(day: string, months: number): string {
    const index = this.getYear(day) * 12 + this.getMonth(day) + months;
    const year = Math.floor(index / 12);
    const month = index - year * 12;
    const last = new Date(Date.UTC(year, month + 1, 0)).getUTCDate();
    return this.createDate(year, month, Math.min(this.getDate(day), last));
  }

  addCalendarDays(day: string, days: number): string {
    const at = utc(day);
    at.setUTCDate(at.getUTCDate() + days);
    return at.toISOString().slice(0, 10);
  }

  toIso8601(day: string): string {
    return day;
  }

  isDateInstance(value: unknown): boolean {
    return typeof value === 'string';
  }

  isValid(day: string): boolean {
    return isCalendarDay(day);
  }

  invalid(): string {
    return 'not a day';
  }

  /** A control's value: '' and null are no day; a day stays itself; anything else is an invalid day. */
  override deserialize(value: unknown): string | null {
    if (value === '' || value === null || value === undefined) return null;
    return super.deserialize(value);
  }
}

/** The text forms the date fields use: yyyy-mm-dd in the field, words for the calendar's headers and screen readers. */
export const DAY_FORMATS: MatDateFormats = {
  parse: { dateInput: 'yyyy-mm-dd' },
  display: { dateInput: 'yyyy-mm-dd', monthYearLabel: 'month-year', dateA11yLabel: 'long', monthYearA11yLabel: 'long-month-year' },
};

const utc = (day: string): Date => {
  const at = new Date(Date.UTC(2000, 0, 1));
  at.setUTCFullYear(Number(day.slice(0, 4)), Number(day.slice(5, 7)) - 1, Number(day.slice(8, 10)));
  return at;
};

/** Every date field shows the form it takes (yyyy-mm-dd) while empty, from the one format above. */
@Directive({ selector: 'input[matInput][matDatepicker]' })
export class DayFieldForm {
  constructor() {
    // Before the input's first check, which copies its placeholder onto the element.
    inject(MatInput).placeholder = DAY_FORMATS.display.dateInput as string;
  }
}

/**
 * Material's date picker, configured once for yyyy-mm-dd days: import this where a page has a date field
 * (`<input matInput [matDatepicker]="p">`, `<mat-datepicker-toggle matIconSuffix [for]="p" />`, `<mat-datepicker #p />`).
 */
@NgModule({
  imports: [MatDatepickerModule, DayFieldForm],
  exports: [MatDatepickerModule, DayFieldForm],
  providers: [{ provide: DateAdapter, useClass: DayDateAdapter }, { provide: MAT_DATE_FORMATS, useValue: DAY_FORMATS }],
})
export class DayDates {}
