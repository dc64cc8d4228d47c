import { componentRecordRoute } from './component-record';

const route = componentRecordRoute('contactors');
export const clientLoader = route.clientLoader;
export default route.ComponentRecordPage;
