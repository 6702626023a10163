<#-- The deck body: everything after the header. Its SHA-256 is recorded in the header. -->
<#include "elements.ftl">
<#include "models.ftl">
<#include "control.ftl">
.end
