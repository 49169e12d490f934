import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

/** One e-mail the server's local SMTP catcher kept instead of sending. */
export interface CapturedMail {
  id: string;
  /** The recipient addresses, reduced by the server to the signed-in person's own. */
  to: string[];
  subject: string;
  text: string;
  receivedAt: number;
}

/** The signed-in person's captured mail, and whether the server runs its catcher at all. */
export interface OwnCapturedMail {
  catcher: boolean;
  address: string;
  messages: CapturedMail[];
}

/** GET /api/dev/mail: only ever the signed-in person's own captured mail. */
@Injectable({ providedIn: 'root' })
export class MailOutboxApi {
  private readonly http = inject(HttpClient);

  /** The local catcher's copy of the mail addressed to the signed-in person. */
  ownMail(): Observable<OwnCapturedMail> {
    return this.http.get<OwnCapturedMail>('/api/dev/mail');
  }
}
