/** Entry of the plan-map page: global styles (Leaflet's bundled CSS first) and the root element. */
import 'leaflet/dist/leaflet.css';
import './styles/app.css';
import './components/drydig-app';
