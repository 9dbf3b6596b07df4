export { default } from "../../+description";
