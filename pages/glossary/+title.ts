import { titled } from "#components/i18n";

export default titled("titles.glossary");
