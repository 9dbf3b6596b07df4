export { default } from "../../+Page";
