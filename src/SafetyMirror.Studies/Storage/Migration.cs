namespace SafetyMirror.Studies.Storage;

/// <summary>One versioned, additive step of a back-end's schema. Steps run in order, each in its own transaction.</summary>
/// <param name="Version">1, 2, … in the order they run.</param>
/// <param name="Name">What the step adds, for the schema_migrations table.</param>
/// <param name="Sql">The statements; they add tables, columns and indexes and fill them, never drop data.</param>
public sealed record Migration(int Version, string Name, string Sql);
