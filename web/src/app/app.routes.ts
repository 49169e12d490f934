import { Injector, inject } from '@angular/core';
import { ResolveFn, Routes } from '@angular/router';
import { authGuard } from './core/auth-guard';
import { loadAlongside } from './core/load-alongside';
import { roleGuard } from './core/role-guard';

// The live view is the first screen after a reload; its code loads while the session is restored.
const liveView = () => import('./live/live').then((m) => m.Live);

// Once the guards have restored the session, the live view's status and stream start while its code still
// loads (core/live-head-start.ts). Resolved at once, so the navigation never waits; the head start's own code
// is fetched lazily, as the stream's code would otherwise join every page's first download.
const liveHeadStart: ResolveFn<true> = (route) => {
  const injector = inject(Injector);
  const systemId = route.paramMap.get('id');
  if (systemId)
    import('./core/live-head-start')
      .then((m) => injector.get(m.LiveHeadStart).start(systemId))
      .catch(() => undefined);
  return true;
};

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
    path: 'systems/new',
    title: 'Set up a system · Cellwarden',
    canActivate: [roleGuard(['installer', 'owner'])],
    loadComponent: () => import('./onboarding/new-system/new-system').then((m) => m.NewSystem),
  },
  {
    path: 'systems/:id',
    title: 'Live · Cellwarden',
    canActivate: [loadAlongside(liveView), authGuard],
    resolve: { headStart: liveHeadStart },
    loadComponent: liveView,
  },
  {
    path: 'systems/:id/history',
    title: 'History · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./history/history').then((m) => m.History),
  },
  {
    path: 'systems/:id/alerts',
    title: 'Alerts · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./alerts/alerts').then((m) => m.Alerts),
  },
  {
    path: 'systems/:id/battery-health',
    title: 'Battery health · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./battery-health/battery-health').then((m) => m.BatteryHealth),
  },
  {
    path: 'systems/:id/settings',
    title: 'System settings · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./settings/settings').then((m) => m.Settings),
  },
  {
    path: 'systems/:id/readings-transfer',
    title: 'Readings CSV · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./readings-transfer/readings-transfer').then((m) => m.ReadingsTransfer),
  },
  {
    path: 'systems/:id/devices',
    title: 'Devices · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./access/devices-page/devices-page').then((m) => m.DevicesPage),
  },
  {
    path: 'systems/:id/access',
    title: 'Access and devices · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./access/access').then((m) => m.Access),
  },
  {
    path: 'systems/:id/commissioning',
    title: 'Commissioning · Cellwarden',
    canActivate: [roleGuard(['installer', 'admin', 'owner'])],
    loadComponent: () => import('./installer/commissioning/commissioning').then((m) => m.Commissioning),
  },
  {
    path: 'systems/:id/install',
    title: 'Install register · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./install-register/install-register').then((m) => m.InstallRegister),
  },
  {
    path: 'requests',
    title: 'Requests · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./requests/requests').then((m) => m.Requests),
  },
  {
    path: 'shared-with-me',
    title: 'Shared with me · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./received-access/received-access').then((m) => m.ReceivedAccess),
  },
  {
    path: 'installer',
    title: 'Installer tools · Cellwarden',
    canActivate: [roleGuard(['installer', 'admin'])],
    loadComponent: () => import('./installer/installer').then((m) => m.Installer),
  },
  {
    path: 'team',
    title: 'Team · Cellwarden',
    canActivate: [roleGuard(['admin'])],
    loadComponent: () => import('./team/team').then((m) => m.Team),
  },
  {
    path: 'mail-outbox',
    title: 'Your mail, local copy · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./mail-outbox/mail-outbox').then((m) => m.MailOutbox),
  },
  {
    path: 'invitation/:token',
    title: 'Accept invitation · Cellwarden',
    loadComponent: () => import('./invitation/invitation').then((m) => m.Invitation),
  },
  {
    path: 'password-reset',
    title: 'Reset password · Cellwarden',
    loadComponent: () => import('./password-reset/password-reset').then((m) => m.PasswordReset),
  },
  {
    path: 'password-reset/:token',
    title: 'Set a new password · Cellwarden',
    loadComponent: () => import('./password-reset/new-password/new-password').then((m) => m.NewPassword),
  },
  {
    path: 'account',
    title: 'Your account · Cellwarden',
    canActivate: [authGuard],
    loadComponent: () => import('./account/account').then((m) => m.Account),
  },
  { path: '', pathMatch: 'full', redirectTo: 'systems' },
  { path: '**', redirectTo: 'systems' },
];
