package cli

// runCompare is replaced by the real command when its engine lands.
func runCompare(env Env, args []string) error { return errNotBuilt }
