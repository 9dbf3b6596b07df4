import { createI18n } from "#components/i18n";

export default () => createI18n().t("preview.pageTitle");
