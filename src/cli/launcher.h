/* launcher.h — the process that starts document workers: a copy of the scheduler forked
 * while it still has one thread, which forks a worker for each document. A worker so
 * started needs no exec (no second program start-up: loading and linking some fifty
 * libraries, about 6 ms a document) and inherits no lock held by another thread, since
 * the launcher never has one; the scheduler's later GLib threads stay out of its copy. */
#pragma once

#include <sys/types.h>

#include <glib.h>

typedef struct pp_launcher pp_launcher;

/* Run in the worker process: the job text as given to pp_launcher_start(), which it owns
 * (g_free); parent is the launcher's pid, for the worker's death-with-parent check. Must
 * not return. */
typedef void (*pp_launcher_job_func)(char *job, gsize len, pid_t parent);
/* A worker ended: the id given to pp_launcher_start() and its wait status. */
typedef void (*pp_launcher_exit_func)(guint id, int wait_status, gpointer data);

/* Forks the launcher. Fails (G_IO_ERROR) when this process already has more than one
 * thread, or when the socket or the fork fails. */
pp_launcher *pp_launcher_new(pp_launcher_job_func run, GError **error);
/* Starts worker id on job, its standard output out_fd (taken: closed here). FALSE when the
 * launcher is gone or the job is too long to send. */
gboolean pp_launcher_start(pp_launcher *l, guint id, const char *job, int out_fd);
/* SIGKILL to worker id, if it is still running. */
void pp_launcher_kill(pp_launcher *l, guint id);
/* TRUE once the launcher is known to have ended (a request could not be sent, or its
 * socket reached end of file). */
gboolean pp_launcher_is_gone(const pp_launcher *l);
/* The socket to watch for pp_launcher_read(). */
int pp_launcher_get_fd(const pp_launcher *l);
/* Calls on_exit for each worker whose end the launcher has reported, without blocking.
 * FALSE when the launcher is gone: its workers were killed with it. */
gboolean pp_launcher_read(pp_launcher *l, pp_launcher_exit_func on_exit, gpointer data);
/* Closes the socket (the launcher then kills what still runs and leaves) and reaps it. */
void pp_launcher_free(pp_launcher *l);
G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_launcher, pp_launcher_free)
