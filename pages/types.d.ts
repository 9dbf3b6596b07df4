import type { Person } from "../server/people";

declare global {
  namespace Vike {
    interface PageContext {
      /** The signed-in person, on the server only. */
      person?: Person | null;
      /** For pages with a form that posts without JavaScript; see server/pages.ts. */
      csrfToken?: string;
    }
  }
}

export {};
