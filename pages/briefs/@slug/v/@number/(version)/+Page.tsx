export { default } from "#pages/briefs/@slug/(latest)/+Page";
