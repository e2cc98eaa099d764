using SafetyMirror.Api.Errors;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Api.Json;
using SafetyMirror.Api.Service;

var builder = WebApplication.CreateBuilder(args);

builder.Services.AddProblemResponses();
builder.Services.AddServiceJson();
builder.Services.AddHealthChecks();

var app = builder.Build();

app.UseExceptionHandler();
app.UseStatusCodePages();

app.MapLanding();
app.MapHealth();
app.MapGroup("/v1").MapEvaluations();

app.Run();
