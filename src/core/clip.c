/* clip.c — reference-counted clip chains.
 * Marks painted under the same clip share one chain instead of copying paths. */
#include "core.h"

pp_clip *pp_clip_new(pp_clip *parent, pp_path *path, pp_fill_rule rule) {
  pp_clip *clip = g_new0(pp_clip, 1);
  clip->ref_count = 1;
  clip->parent = parent ? pp_clip_ref(parent) : NULL;
  clip->path = path;
  clip->rule = rule;
  return clip;
}

pp_clip *pp_clip_ref(pp_clip *clip) {
  if (clip)
    clip->ref_count++;
  return clip;
}

void pp_clip_unref(pp_clip *clip) {
  /* Iterative so a deep chain (thousands of nested clips) cannot blow the stack. */
  while (clip && --clip->ref_count == 0) {
    pp_clip *parent = clip->parent;
    pp_path_free(clip->path);
    g_free(clip);
    clip = parent;
  }
}

size_t pp_clip_depth(const pp_clip *clip) {
  size_t n = 0;
  for (; clip; clip = clip->parent)
    n++;
  return n;
}
