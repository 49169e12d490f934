import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

/** One e-mail the server's local SMTP catcher kept instead of sending. */
export interface CapturedMail {
  id: string;
  to: string;
  subject: string;
  text: string;
  receivedAt: number;
}

/** The captured-mail endpoint, answered only while the server runs its local SMTP catcher. */
@Injectable({ providedIn: 'root' })
export class MailOutboxApi {
  private readonly http = inject(HttpClient);

  /** Captured e-mail, as the server lists it. */
  messages(): Observable<CapturedMail[]> {
    return this.http.get<{ messages: CapturedMail[] }>('/api/dev/mail').pipe(map((body) => body.messages));
  }
}
