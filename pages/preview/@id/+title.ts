export default "Preview of a draft · Fairweigh";
