using SafetyMirror.Api.Errors;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Api.Features.Recommendations;
using SafetyMirror.Api.Features.Reports;
using SafetyMirror.Api.Json;
using SafetyMirror.Api.Limits;
using SafetyMirror.Api.OpenApi;
using SafetyMirror.Api.Service;

var builder = WebApplication.CreateBuilder(args);

builder.AddRequestLimits();
builder.Services.AddProblemResponses();
builder.Services.AddServiceJson();
builder.Services.AddHealthChecks();
builder.Services.AddServiceOpenApi();
builder.Services.AddSingleton(TimeProvider.System);

var app = builder.Build();

app.UseProblemResponses();
app.UseRequestBodyLimit();
app.UseRateLimiter();
app.UseServiceOpenApi();

app.MapLanding();
app.MapHealth();
var v1 = app.MapGroup("/v1").WithRequestLimits();
v1.MapEvaluations();
v1.MapRecommendations();
v1.MapReports();

app.Run();
