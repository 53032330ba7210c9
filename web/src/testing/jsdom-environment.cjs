/**
 * jsdom lacks the Fetch API classes the data router builds its navigation
 * requests with (Request, Response, Headers). Node 20 has them: hand them to
 * the test window, together with the streams and encoders they rely on.
 */
const { TestEnvironment } = require('jest-environment-jsdom');

const FROM_NODE = [
  'fetch',
  'Request',
  'Response',
  'Headers',
  'FormData',
  'ReadableStream',
  'WritableStream',
  'TransformStream',
  'TextEncoder',
  'TextDecoder',
  'structuredClone',
];

class SaglineJsdomEnvironment extends TestEnvironment {
  constructor(config, context) {
    super(config, context);
    for (const name of FROM_NODE) {
      if (typeof globalThis[name] !== 'undefined') this.global[name] = globalThis[name];
    }
  }
}

module.exports = SaglineJsdomEnvironment;
