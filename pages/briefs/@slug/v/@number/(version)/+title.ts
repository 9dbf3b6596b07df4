export { default } from "../../../(latest)/+title";
