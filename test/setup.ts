import { installCustomFunctionsShim } from "../src/preview/customFunctionsShim";

installCustomFunctionsShim();
