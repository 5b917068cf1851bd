// Server specs talk to MariaDB and sometimes start the server process: allow more than Jasmine's 5 s.
jasmine.DEFAULT_TIMEOUT_INTERVAL = 60_000;
