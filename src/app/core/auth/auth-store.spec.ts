import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { apiError, httpController, provideTestHttp } from '../../../testing/http';
import { sessionUser } from '../../../testing/session-users';
import { ApiError } from '../http/api-error';
import { Notices } from '../notify/notices';
import { AuthStore } from './auth-store';

describe('AuthStore', () => {
  let store: AuthStore;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: provideTestHttp() });
    store = TestBed.inject(AuthStore);
  });

  afterEach(() => httpController().verify());

  it('restores the signed-in user from GET /api/v1/session', async () => {
    const done = store.restore();
    httpController().expectOne({ method: 'GET', url: '/api/v1/session' }).flush(sessionUser(['director']));
    await done;
    expect(store.signedIn()).toBe(true);
    expect(store.user()?.name).toBe('Ada Tester');
    expect(store.roles()).toEqual(['director']);
    expect(store.checked()).toBe(true);
  });

  it('treats a 401 from the session probe as signed out, without failing start-up', async () => {
    const done = store.restore();
    httpController()
      .expectOne('/api/v1/session')
      .flush(apiError('Not signed in'), { status: 401, statusText: 'Unauthorized' });
    await expect(done).resolves.toBeUndefined();
    expect(store.signedIn()).toBe(false);
    expect(store.checked()).toBe(true);
  });

  it('signs in with POST /api/v1/session and keeps the answered user', async () => {
    const result = firstValueFrom(store.signIn({ email: 'ada@valeharbor.example', password: 'secret' }));
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/session' });
    expect(req.request.body).toEqual({ email: 'ada@valeharbor.example', password: 'secret' });
    req.flush(sessionUser(['technologist', 'director']));
    await result;
    expect(store.hasAnyRole(['director'])).toBe(true);
    expect(store.hasAnyRole(['admin', 'quality'])).toBe(false);
  });

  it('drops a notice left from the last session when the next person signs in', async () => {
    const notices = TestBed.inject(Notices);
    notices.post('You are signed out.');
    const result = firstValueFrom(store.signIn({ email: 'ada@valeharbor.example', password: 'secret' }));
    httpController().expectOne('/api/v1/session').flush(sessionUser(['technologist']));
    await result;
    expect(notices.message()).toBeNull();
    expect(notices.take()).toBeNull();
  });

  it('keeps a waiting notice when sign-in is refused (the sign-in page still shows it)', async () => {
    const notices = TestBed.inject(Notices);
    notices.post('You are signed out.');
    const result = firstValueFrom(store.signIn({ email: 'ada@valeharbor.example', password: 'wrong' }));
    httpController().expectOne('/api/v1/session').flush(apiError('E-mail or password is wrong'), { status: 401, statusText: 'Unauthorized' });
    await expect(result).rejects.toBeInstanceOf(ApiError);
    expect(notices.message()).toBe('You are signed out.');
  });

  it('passes on the server’s words when sign-in is refused, and stays signed out', async () => {
    const result = firstValueFrom(store.signIn({ email: 'ada@valeharbor.example', password: 'wrong' }));
    httpController()
      .expectOne('/api/v1/session')
      .flush(apiError('E-mail or password is wrong, or the account is locked'), { status: 401, statusText: 'Unauthorized' });
    await expect(result).rejects.toEqual(new ApiError(401, 'E-mail or password is wrong, or the account is locked'));
    expect(store.signedIn()).toBe(false);
  });

  it('forgets the user after DELETE /api/v1/session', async () => {
    const restored = store.restore();
    httpController().expectOne('/api/v1/session').flush(sessionUser(['admin']));
    await restored;
    const out = firstValueFrom(store.signOut(), { defaultValue: undefined });
    httpController().expectOne({ method: 'DELETE', url: '/api/v1/session' }).flush(null, { status: 204, statusText: 'No Content' });
    await out;
    expect(store.signedIn()).toBe(false);
    expect(store.roles()).toEqual([]);
  });
});
