export { default } from "../../../(latest)/+Page";
