import { useTranslation } from "react-i18next";
import { TokenActionPage } from "#components/TokenActionPage";

export default function Page() {
  const { t } = useTranslation();
  return <TokenActionPage title={t("subscriptions.confirmTitle")} lead={t("subscriptions.confirmLead")} action="/api/subscriptions/confirm" button={t("subscriptions.confirm")} />;
}
