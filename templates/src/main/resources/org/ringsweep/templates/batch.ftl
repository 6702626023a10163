<#-- The master deck of a batch (ngspice.md §2): one ngspice process runs several circuit-only
     decks in turn. Per entry: source the deck, run, write its probes to its own raw file, then
     echo the marker `RSW_DONE <k> <last time>` that tells the engine entry k completed, and
     clear the plots and the circuit for the next one. Every name here is generated and safe. -->
ringsweep batch
.control
set filetype=${filetype}
<#list entries as e>
source ${e.deck}
run
write ${e.raw}<#list e.probes as p> v(${p})</#list>
let tlast = time[length(time)-1]
echo RSW_DONE ${e?index} $&tlast
destroy all
remcirc
</#list>
quit 0
.endc
.end
