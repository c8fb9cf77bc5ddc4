// The one export of swagger-ui-dist's browser bundle that /api uses (the package ships no types).
declare module 'swagger-ui-dist/swagger-ui-bundle.js' {
  interface SwaggerUIOptions {
    url: string;
    dom_id: string;
    validatorUrl: string | null;
    deepLinking?: boolean;
    docExpansion?: 'list' | 'full' | 'none';
    defaultModelsExpandDepth?: number;
    supportedSubmitMethods?: string[];
    tryItOutEnabled?: boolean;
  }
  const SwaggerUIBundle: (options: SwaggerUIOptions) => unknown;
  export default SwaggerUIBundle;
}
