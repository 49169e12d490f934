import { Routes } from '@angular/router';
import { authGuard } from './core/auth-guard';

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Cellwarden',
    loadComponent: () => import('./sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: 'systems',
    title: 'Systems · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./systems/systems').then((m) => m.Systems),
  },
  {
    path: 'systems/:id',
    title: 'Live · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./live/live').then((m) => m.Live),
  },
  { path: '', pathMatch: 'full', redirectTo: 'systems' },
  { path: '**', redirectTo: 'systems' },
];
