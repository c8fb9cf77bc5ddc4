// Astro Actions for the plain HTML forms of the reading and bench side. Each renders its answer on the page
// that posted it, so a refused form comes back with what was typed and nothing travels through the address.
import { defineAction } from 'astro:actions';
import { submitBenchReportForm } from './bench-report';
import { submitReportFixForm } from './report-fix';
import { submitFollowForm, submitMarkReadForm, submitNotificationSettingsForm } from './following';

// No `input` schema: Astro 5's form reader unwraps schemas with zod 3 classes, and this project's zod 4
// schemas (resolved in the server bundle) make it throw. Each handler takes the FormData and checks it with
// the one shared zod 4 schema, answering refusals with what was typed.
export const server = {
  benchReport: defineAction({ accept: 'form', handler: submitBenchReportForm }),
  reportFix: defineAction({ accept: 'form', handler: submitReportFixForm }),
  follow: defineAction({ accept: 'form', handler: submitFollowForm }),
  markNotificationsRead: defineAction({ accept: 'form', handler: submitMarkReadForm }),
  notificationSettings: defineAction({ accept: 'form', handler: submitNotificationSettingsForm }),
};
