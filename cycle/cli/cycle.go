package cli

// runCycle is replaced by the real command when its engine lands.
func runCycle(env Env, args []string) error { return errNotBuilt }
