import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { Auth } from './auth';

/** Lets signed-in users through; everyone else goes to /sign-in. */
export const authGuard: CanActivateFn = () =>
  inject(Auth).isSignedIn() ? true : inject(Router).createUrlTree(['/sign-in']);
