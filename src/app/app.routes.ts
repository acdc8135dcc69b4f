import { Routes } from '@angular/router';
import { provideUploadingHttpClient } from './retune/upload-http';

export const routes: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'design' },
  {
    path: 'design',
    title: 'Design · Keyloom',
    loadComponent: () => import('./design/design-page').then((m) => m.DesignPage),
  },
  {
    path: 'presets/:id',
    title: 'Preset · Keyloom',
    loadComponent: () => import('./design/design-page').then((m) => m.DesignPage),
  },
  {
    path: 'library',
    title: 'Library · Keyloom',
    loadComponent: () => import('./library/library-page').then((m) => m.LibraryPage),
  },
  {
    path: 'library/:id/history',
    title: 'History · Keyloom',
    loadComponent: () => import('./library/history-page').then((m) => m.HistoryPage),
  },
  {
    path: 'retune',
    title: 'Retune · Keyloom',
    providers: [provideUploadingHttpClient()],
    loadComponent: () => import('./retune/retune-page').then((m) => m.RetunePage),
  },
  {
    path: 'temperaments',
    title: 'Generator search · Keyloom',
    loadComponent: () => import('./temperaments/temperaments-page').then((m) => m.TemperamentsPage),
  },
  {
    path: 'import',
    title: 'Import · Keyloom',
    loadComponent: () => import('./import/import-page').then((m) => m.ImportPage),
  },
  {
    path: 'bands',
    title: 'Bands · Keyloom',
    loadComponent: () => import('./bands/bands-page').then((m) => m.BandsPage),
  },
  {
    path: 'bands/:id',
    title: 'Band · Keyloom',
    loadComponent: () => import('./bands/band-page').then((m) => m.BandPage),
  },
  {
    path: 'instruments',
    title: 'My instruments · Keyloom',
    loadComponent: () => import('./instruments/instruments-page').then((m) => m.InstrumentsPage),
  },
  {
    path: 'invites/:token',
    title: 'Invite · Keyloom',
    loadComponent: () => import('./invites/invite-page').then((m) => m.InvitePage),
  },
  {
    path: 'stage/:setlistId',
    title: 'Stage · Keyloom',
    loadComponent: () => import('./stage/stage-page').then((m) => m.StagePage),
  },
  {
    path: 'tuner',
    title: 'Tuner · Keyloom',
    loadComponent: () => import('./tuner/tuner-page').then((m) => m.TunerPage),
  },
  {
    path: 's/:token',
    title: 'Shared preset · Keyloom',
    loadComponent: () => import('./share/shared-page').then((m) => m.SharedPage),
  },
  {
    path: '**',
    title: 'Not found · Keyloom',
    loadComponent: () => import('./not-found/not-found-page').then((m) => m.NotFoundPage),
  },
];
