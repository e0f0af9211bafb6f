#!/usr/bin/zsh -f
# Prints the matches zsh's completion system offers at the end of a command line, one a line.
# Usage: zsh_complete.zsh COMPLETION_FOLDER 'command line'. An interactive zsh in a pseudo-terminal
# (zsh/zpty) loads compinit with the folder first in fpath; compadd is wrapped to print what it
# would add; the line is typed with a Tab, and the shell exits after that one completion.
zmodload zsh/zpty
zpty z zsh -f -i
zpty -w z "PS1='' PROMPT='' RPROMPT=''; fpath=($1 \$fpath); autoload -U compinit; compinit -u -D"
# The marker is spelled so that the echoed definition itself does not carry it.
zpty -w z 'compadd() { if (( ${@[(I)-[OAD]]} )); then builtin compadd "$@"; return; fi;
  local -a h; builtin compadd -O h "$@"; print -rl -- "${:-MAT}CH:"${^h}; }'
zpty -w z "comppostfuncs=(exit)"
zpty -w z "bindkey '^I' complete-word"
zpty -w z "$2"$'\t'
out=""
for i in {1..100}; do  # up to 10 s for the shell to answer
  while zpty -r -t z chunk; do out+=$chunk; done
  if [[ $out == *MATCH:* ]]; then sleep 0.3; while zpty -r -t z chunk; do out+=$chunk; done; break; fi
  sleep 0.1
done
zpty -d z
print -r -- "$out" | tr -d '\r' | grep -ao 'MATCH:[^[:space:]]*' | sed 's/^MATCH://' | sort -u
