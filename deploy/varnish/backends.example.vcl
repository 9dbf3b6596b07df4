# The app's processes, for deploy/varnish/fairweigh.vcl: one backend each, behind one round-robin
# director named `app`. `npm run check:cdn` writes its own with the ports it chose.
backend app1 {
  .host = "127.0.0.1";
  .port = "3001";
}

backend app2 {
  .host = "127.0.0.1";
  .port = "3002";
}

sub vcl_init {
  new app = directors.round_robin();
  app.add_backend(app1);
  app.add_backend(app2);
}
