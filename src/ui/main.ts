/**
 * Entry of the page: defines the elements; <atlas-app> in index.html does the rest.
 */
import './app/atlas-app.ts';
