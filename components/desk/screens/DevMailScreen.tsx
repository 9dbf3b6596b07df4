// /desk/dev/mail: what the development mailbox received, so a developer can follow an invitation or a
// reset link without a real mail server. The API answers 404 outside development.
import { useTranslation } from "react-i18next";
import { useDevMail } from "../queries";

export function DevMailScreen() {
  const { t } = useTranslation();
  const mail = useDevMail();
  return (
    <>
      <h1 className="text-4xl font-semibold tracking-tight">{t("desk.devMail.title")}</h1>
      <p className="mt-2 text-muted">{t("desk.devMail.lead")}</p>
      {mail.isError ? <p role="alert">{t("desk.error", { message: mail.error.message })}</p> : null}
      {mail.data?.length === 0 ? <p className="mt-4">{t("desk.devMail.empty")}</p> : null}
      <ol className="mt-6 space-y-6" data-testid="dev-mail">
        {mail.data?.map((message) => (
          <li key={`${message.receivedAt}-${message.to}`} className="border border-rule bg-white p-4">
            <h2 className="font-semibold">{message.subject}</h2>
            <p className="font-sans text-sm text-muted">{t("desk.devMail.to", { to: message.to, at: message.receivedAt })}</p>
            <pre className="mt-2 overflow-x-auto whitespace-pre-wrap font-sans text-sm">{message.text}</pre>
          </li>
        ))}
      </ol>
    </>
  );
}
