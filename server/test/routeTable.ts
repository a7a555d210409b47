// The route table lives beside the metrics that label requests by it; tests keep importing it from here.
export { routeTable, type RouteEntry } from '../observability/routeTemplates';
