import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { apiErrorInterceptor } from '../app/core/http/api-error.interceptor';

/** HttpClient with the app's own interceptor, answered by HttpTestingController. */
export function provideTestHttp() {
  return [provideRouter([]), provideHttpClient(withInterceptors([apiErrorInterceptor])), provideHttpClientTesting()];
}

export function httpController(): HttpTestingController {
  return TestBed.inject(HttpTestingController);
}

/** The body of an API error answer. */
export function apiError(error: string, issues: { path: string; message: string }[] = []) {
  return { error, issues };
}

/** Material without animations, so dialogs and menus open and close at once in tests. */
export const noAnimations = { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } };
