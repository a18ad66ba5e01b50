package cli

import (
	"fmt"
	"strings"
)

const completionSynopsis = "completion bash|zsh|fish"

// runCompletion prints a shell completion script. It is generated from the
// command table and the global flags; the flags of a command are read at
// completion time from "enthalpath help COMMAND" (the one list of its
// flags, the global ones included), so the script never drifts from the
// program it completes.
func runCompletion(env Env, args []string) error {
	fs := NewFlagSet("completion")
	pos, help, err := ParseFlags(fs, args)
	if help || err != nil {
		return err
	}
	if len(pos) != 1 {
		return Usagef("give one shell: usage: enthalpath %s", completionSynopsis)
	}
	script, err := completionScript(pos[0])
	if err != nil {
		return err
	}
	_, err = fmt.Fprint(env.Stdout, script)
	return err
}

func completionScript(shell string) (string, error) {
	var names, globals, withValue, fish []string
	for _, c := range commandTable(Interactive{}) {
		names = append(names, c.name)
	}
	for _, g := range globalFlags() {
		globals = append(globals, "--"+g.name)
		withValue = append(withValue, "--"+g.name, "-"+g.name) // each takes a value
		fish = append(fish, fmt.Sprintf("complete -c enthalpath -l %s -r -d %s", g.name, fishQuote(g.usage)))
	}
	fill := strings.NewReplacer("@COMMANDS@", strings.Join(names, " "), "@GLOBALS@", strings.Join(globals, " "),
		"@WITHVALUE@", strings.Join(withValue, "|"), "@FISHGLOBALS@", strings.Join(fish, "\n"))
	switch shell {
	case "bash", "zsh":
		script := fill.Replace(bashCompletion)
		if shell == "zsh" {
			script = "autoload -U +X bashcompinit && bashcompinit\n" + script
		}
		return script, nil
	case "fish":
		return fill.Replace(fishCompletion), nil
	}
	return "", Usagef("completion %q: give bash, zsh or fish", shell)
}

// bashCompletion completes the command, then its --flags (from its
// --help), then file names. zsh runs it through bashcompinit.
const bashCompletion = `# enthalpath completion (bash; zsh through bashcompinit)
# Load it with:  source <(enthalpath completion bash)
_enthalpath() {
	local cur=${COMP_WORDS[COMP_CWORD]} cmd="" i
	for ((i = 1; i < COMP_CWORD; i++)); do
		case ${COMP_WORDS[i]} in
		@WITHVALUE@) ((i++)) ;;
		-*) ;;
		*) cmd=${COMP_WORDS[i]}; break ;;
		esac
	done
	if [[ -z $cmd ]]; then
		COMPREPLY=($(compgen -W "@COMMANDS@ @GLOBALS@ --version --help" -- "$cur"))
		return
	fi
	if [[ $cur == -* ]]; then
		COMPREPLY=($(compgen -W "$(enthalpath help "$cmd" 2>&1 | sed -n 's/^  \(--[a-z0-9-]*\).*/\1/p')" -- "$cur"))
		return
	fi
	COMPREPLY=($(compgen -f -- "$cur"))
}
complete -o default -F _enthalpath enthalpath
`

const fishCompletion = `# enthalpath completion (fish)
# Load it with:  enthalpath completion fish | source
complete -c enthalpath -n __fish_use_subcommand -f -a '@COMMANDS@'
@FISHGLOBALS@
complete -c enthalpath -n __fish_use_subcommand -l version -d 'version and commit'
for cmd in @COMMANDS@
	complete -c enthalpath -n "__fish_seen_subcommand_from $cmd" -a "(enthalpath help $cmd 2>&1 | string match -r '^  --[a-z0-9-]+' | string trim)"
end
`

// fishQuote quotes s for fish in single quotes.
func fishQuote(s string) string {
	return "'" + strings.NewReplacer(`\`, `\\`, `'`, `\'`).Replace(s) + "'"
}
