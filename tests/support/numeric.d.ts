declare module "numeric";
