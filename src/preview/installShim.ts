/**
 * Side effect only: installs the CustomFunctions stand-in before the cell functions are imported (import this first).
 */
import { installCustomFunctionsShim } from "./customFunctionsShim";

installCustomFunctionsShim();
