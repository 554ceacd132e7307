// Integration tests run against the app server and MariaDB that scripts/test.sh started.
process.env.APP_URL ??= 'http://localhost:3100';
