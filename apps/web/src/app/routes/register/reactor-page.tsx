import { componentRecordRoute } from './component-record';

const route = componentRecordRoute('reactors');
export const clientLoader = route.clientLoader;
export default route.ComponentRecordPage;
