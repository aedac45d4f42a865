// App entry: configure zod before any schema is built, then hand over to Expo Router.
import './lib/zod-config';
import 'expo-router/entry';
