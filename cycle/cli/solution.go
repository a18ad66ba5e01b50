package cli

// runSolution is replaced by the real command when its engine lands.
func runSolution(env Env, args []string) error { return errNotBuilt }
