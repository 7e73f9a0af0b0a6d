import { HttpClient } from '@angular/common/http';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { apiError, httpController, provideTestHttp } from '../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../testing/session-users';
import { AuthStore } from '../auth/auth-store';
import { ApiError } from './api-error';

describe('apiErrorInterceptor', () => {
  let http: HttpClient;
  let navigate: jest.SpyInstance;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [...provideTestHttp(), provideSession(sessionUser(['admin']))] });
    http = TestBed.inject(HttpClient);
    navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  });

  afterEach(() => httpController().verify());

  it('hands callers an ApiError with the server’s message and issues', async () => {
    const call = firstValueFrom(http.post('/api/v1/users', {}));
    httpController()
      .expectOne('/api/v1/users')
      .flush(apiError('Check the fields', [{ path: 'email', message: 'Enter a valid e-mail address' }]), { status: 400, statusText: 'Bad Request' });
    await expect(call).rejects.toEqual(new ApiError(400, 'Check the fields', [{ path: 'email', message: 'Enter a valid e-mail address' }]));
    expect(navigate).not.toHaveBeenCalled();
  });

  it('forgets the user and sends them to sign in when another call answers 401', async () => {
    await restoreSession();
    const call = firstValueFrom(http.get('/api/v1/users'));
    httpController().expectOne('/api/v1/users').flush(apiError('Sign in first'), { status: 401, statusText: 'Unauthorized' });
    await expect(call).rejects.toBeInstanceOf(ApiError);
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { next: '/' } });
    expect(TestBed.inject(AuthStore).signedIn()).toBe(false);
  });

  it('leaves a 401 from the session probe or sign-in to the caller', async () => {
    const probe = firstValueFrom(http.get('/api/v1/session'));
    httpController().expectOne('/api/v1/session').flush(apiError('Not signed in'), { status: 401, statusText: 'Unauthorized' });
    await expect(probe).rejects.toMatchObject({ status: 401 });
    expect(navigate).not.toHaveBeenCalled();
  });

  it('words a failure without a JSON body, such as a lost connection', async () => {
    const call = firstValueFrom(http.get('/api/v1/analytes'));
    httpController().expectOne('/api/v1/analytes').error(new ProgressEvent('error'), { status: 0, statusText: '' });
    await expect(call).rejects.toMatchObject({ status: 0, message: 'The server cannot be reached. Check the connection and try again.' });
  });

  it('shows the server’s text when rate limiting answers 429 in plain text', async () => {
    const call = firstValueFrom(http.post('/api/v1/session', {}));
    httpController().expectOne('/api/v1/session').flush('Too many sign-in attempts; wait 15 minutes.', { status: 429, statusText: 'Too Many' });
    await expect(call).rejects.toMatchObject({ status: 429, message: 'Too many sign-in attempts; wait 15 minutes.' });
  });
});
