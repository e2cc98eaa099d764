using SafetyMirror.Api.Access;
using SafetyMirror.Api.Errors;
using SafetyMirror.Api.Features.Batches;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Api.Features.Recommendations;
using SafetyMirror.Api.Features.Reports;
using SafetyMirror.Api.Features.Studies;
using SafetyMirror.Api.Features.Views;
using SafetyMirror.Api.Json;
using SafetyMirror.Api.Limits;
using SafetyMirror.Api.OpenApi;
using SafetyMirror.Api.Pages;
using SafetyMirror.Api.Service;

// The container's health check runs this on every tick: answer it before building anything else.
if (ProbeCommand.IsRequested(args))
{
    Environment.ExitCode = await ProbeCommand.RunAsync(args, Console.Out, Console.Error);
    return;
}

var builder = WebApplication.CreateBuilder(args);

builder.AddServiceTelemetry();
builder.AddPosture();
builder.AddAccess();
builder.AddRequestLimits();
builder.AddStudies();
builder.AddBatches();
builder.Services.AddProblemResponses();
builder.Services.AddServiceJson();
builder.Services.AddHealthChecks();
builder.Services.AddServiceOpenApi();
builder.Services.AddSingleton(TimeProvider.System);
builder.Services.AddStudyPages();

var app = builder.Build();

if (CreateKeyCommand.IsRequested(args))
{
    Environment.ExitCode = await CreateKeyCommand.RunAsync(args, app.Services, Console.Out, Console.Error);
    return;
}

app.UsePosture();
app.UseProblemResponses();
app.UseRequestBodyLimit();
app.UseCors();
app.UseAuthentication();
app.UseRateLimiter();
app.UseAuthorization();
app.UseWorkBudget();
if (app.Services.GetRequiredService<PostureOptions>().ServeOpenApi)
{
    app.UseServiceOpenApi();
}

app.MapHealth();
if (!ServiceRoles.Of(app.Configuration).AnswersRequests())
{
    // A worker instance works through batches and answers only its health probes.
    app.Run();
    return;
}

app.MapLanding();
var v1 = app.MapGroup("/v1").WithRequestLimits();
var evaluations = v1.MapEvaluations();
var views = v1.MapViews();
if (!app.Services.GetRequiredService<AccessOptions>().OpenEvaluations)
{
    evaluations.RequireApiKey();
    views.RequireApiKey();
}

v1.MapRecommendations().RequireApiKey().WithWorkBudget();
v1.MapReports().RequireApiKey().WithWorkBudget();
v1.MapStudies();
v1.MapRevisionView();
v1.MapBatches();
v1.MapCaller();
app.MapStudyPages();

app.Run();
