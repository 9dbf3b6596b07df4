import { useTranslation } from "react-i18next";
import { TokenActionPage } from "#components/TokenActionPage";

export default function Page() {
  const { t } = useTranslation();
  return <TokenActionPage title={t("subscriptions.unsubscribeTitle")} lead={t("subscriptions.unsubscribeLead")} action="/api/subscriptions/unsubscribe" button={t("subscriptions.unsubscribe")} />;
}
