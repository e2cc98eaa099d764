using SafetyMirror.Core.Design;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.View;

/// <summary>A road user standing on an approach, as the evaluation places it: the middle of its front face on the station, facing
/// the direction of travel.</summary>
/// <param name="ApproachIndex">Which of the plan's approaches, from 0.</param>
/// <param name="Station">The station and the direction of travel there.</param>
/// <param name="RoadUser">Who stands there.</param>
/// <param name="AtRequiredDistance">Placed at the approach's required sight distance (rather than at a station the caller picked).</param>
public sealed record PlacedRoadUser(int ApproachIndex, StationPoint Station, RoadUser RoadUser, bool AtRequiredDistance);

/// <summary>A road user the caller wants in the picture: which approach, how far up it, and who.</summary>
/// <param name="ApproachIndex">Which of the plan's approaches, from 0.</param>
/// <param name="StationM">Metres upstream from the approach's conflict point.</param>
/// <param name="RoadUser">Who stands there.</param>
public sealed record RoadUserAtStation(int ApproachIndex, double StationM, RoadUser RoadUser);
