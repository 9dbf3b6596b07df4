import { useTranslation } from "react-i18next";
import { ChoosePasswordForm } from "#components/account/ChoosePasswordForm";

export default function Page() {
  const { t } = useTranslation();
  return <ChoosePasswordForm title={t("account.choose.resetTitle")} />;
}
