// A page behind a one-time link that acts only when the reader clicks (a mail scanner that follows the
// link changes nothing): the token goes in a form to the API.
import { useTranslation } from "react-i18next";
import { usePageContext } from "vike-react/usePageContext";

export function TokenActionPage({ title, lead, action, button }: { title: string; lead: string; action: string; button: string }) {
  const pageContext = usePageContext();
  useTranslation();
  return (
    <div className="max-w-md">
      <h1 className="text-4xl font-semibold tracking-tight">{title}</h1>
      <p className="mt-4 text-lg text-muted">{lead}</p>
      <form method="post" action={action} className="mt-8 font-sans">
        <input type="hidden" name="token" value={String(pageContext.routeParams.token ?? "")} />
        <button type="submit" className="bg-accent px-6 py-2 text-base font-semibold text-white hover:opacity-90">
          {button}
        </button>
      </form>
    </div>
  );
}
