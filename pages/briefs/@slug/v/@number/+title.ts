export { default } from "../../+title";
