package cli

// runScan is replaced by the real command when its engine lands.
func runScan(env Env, args []string) error { return errNotBuilt }
