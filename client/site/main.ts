/** Entry of the site view page (`/site/<token>`): one <site-view> reading its token from the address. */
import './site-view';
