<#-- The analysis and the batch control block (ngspice.md §2, §3): run, write the probes,
     quit 3 when the run stopped short of the stop time, else quit 0. A circuit-only deck (one
     point of a batch, sourced by batch.ftl's master deck) ends after the analysis line. -->
<#if conservative>
.options method=gear reltol=1e-4
</#if>
.tran ${step} ${stop} 0 ${maxStep}
<#if !circuitOnly>
.control
set filetype=${filetype}
run
write ${raw}<#list probes as p> v(${p})</#list>
let tlast = time[length(time)-1]
if tlast < ${stopCheck}
  quit 3
end
quit 0
.endc
</#if>
