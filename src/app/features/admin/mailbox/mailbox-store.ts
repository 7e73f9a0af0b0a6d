import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { MailMessage } from '@shared/schemas';
import { ListStore } from '../catalog/list-store';

/** GET /api/v1/mailbox: the e-mails Parallax has sent, newest first. */
@Injectable({ providedIn: 'root' })
export class MailboxStore extends ListStore<MailMessage> {
  private readonly http = inject(HttpClient);

  protected fetch(): Observable<MailMessage[]> {
    return this.http.get<MailMessage[]>('/api/v1/mailbox');
  }
}
